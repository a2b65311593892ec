import { describe, expect, it } from 'vitest';
import {
  defaultReadinessSettings,
  readinessChecks,
  readinessSettingsSchema,
  runChecks,
  settingDescriptions,
  worstLight,
  type ChecklistAnswers,
  type DrivewayPlan,
  type Light,
  type UploadSummary,
} from '../../src/lib/readiness';

const TODAY = '2025-03-03';

// A case every check should clear, worked check by check:
// - MPAN 1312345678907: the published worked example (sum 1349, mod 11 = 7).
// - 100 A cut-out, nothing big declared: 10 A baseline + 32 A charger = 42 A → 58 A spare.
// - ENA: 42 A ≤ 60 A, within the cut-out, not looped → notify-after.
// - TN-S earthing: 722.411.4.1's PME restriction does not apply.
// - 10 m through the wall: 2.5 mm² drops 19 × 32 × 10 / 1000 = 6.08 V (2.64%) ≤ 11.5 V.
// - Plan: front-left port, nose-in, charge point (2.6, 0): 1.526 m + 1 m slack ≤ 5 m tether.
// - Attached driveway. Delivery 2025-05-02: 60 days − 21 days lead = 39 spare ≥ 7.
// - Owner, used car: the four photos, all accepted.
const plan: DrivewayPlan = {
  wall: { x0: 0, x1: 10 },
  chargePoint: { x: 2.6, y: 0 },
  bays: [{ x: 0, y: 0.5, width: 2.4, length: 4.8, angle: 0 }],
  car: { sizeClass: 'medium' },
  chargePort: 'front-left',
};

function clearCase(): ChecklistAnswers {
  return {
    about: { fullName: 'Ada Example', email: 'ada@example.com', tenure: 'owner', propertyType: 'house' },
    vehicle: { condition: 'used', deliveryDate: '2025-05-02', connector: 'type2', chargePort: 'front-left' },
    supply: {
      mpanCore: '1312345678907',
      mainFuseAmps: 100,
      looped: 'no',
      earthing: 'tns',
      loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false },
    },
    parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
    charger: { cableRunMetres: 10, route: 'through-wall', softGround: false, preference: 'tethered', tetherMetres: 5, plan },
  };
}

const photos: UploadSummary[] = ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo'].map(
  (kind) => ({ kind, status: 'accepted' }) as UploadSummary,
);

function lightOf(result: ReturnType<typeof runChecks>, id: string): Light | undefined {
  return result.checks.find((check) => check.id === id)?.light;
}

describe('worstLight', () => {
  it.each([
    { lights: [], worst: 'green' },
    { lights: ['green', 'green'], worst: 'green' },
    { lights: ['green', 'amber'], worst: 'amber' },
    { lights: ['amber', 'red', 'green'], worst: 'red' },
    { lights: ['red', 'amber'], worst: 'red' },
  ] as const)('$lights → $worst', ({ lights, worst }) => {
    expect(worstLight(lights)).toBe(worst);
  });
});

describe('runChecks', () => {
  it('runs every check in the published order', () => {
    const ids = ['supply-identity', 'supply-headroom', 'network-operator', 'earthing', 'cable-run', 'cable-reach', 'parking', 'timing', 'documents'];
    expect(readinessChecks.map((check) => check.id)).toEqual(ids);
    expect(runChecks({ answers: {}, today: TODAY }).checks.map((check) => check.id)).toEqual(ids);
  });

  it('is green with no gaps for a case that clears every check', () => {
    const result = runChecks({ answers: clearCase(), uploads: photos, today: TODAY });
    expect(result.checks.filter((check) => check.light !== 'green').map((check) => [check.id, check.staffText])).toEqual([]);
    expect(result).toMatchObject({ light: 'green', gapCount: 0 });
  });

  it('takes the worst light and counts every non-green check as a gap', () => {
    // Amber only: the cable goes through the house (extra cost) → amber, 1 gap.
    const amber = clearCase();
    amber.charger = { ...amber.charger, route: 'through-house' };
    expect(runChecks({ answers: amber, uploads: photos, today: TODAY })).toMatchObject({ light: 'amber', gapCount: 1 });
    // Add a red: no off-street parking → red; 2 gaps.
    amber.parking = { ...amber.parking, kind: 'none' };
    expect(runChecks({ answers: amber, uploads: photos, today: TODAY })).toMatchObject({ light: 'red', gapCount: 2 });
  });

  it('is amber, not red, when nothing has been answered yet', () => {
    const result = runChecks({ answers: null, uploads: null, today: TODAY });
    expect(result.light).toBe('amber');
    expect(result.gapCount).toBe(9);
  });

  it('turns headroom red for 60 A with a 10.5 kW shower, and green again at 100 A', () => {
    // 10 + 45.652 + 32 = 87.65 A: over 60 A → red; 100 A leaves 12.35 A ≥ 10 A margin → green.
    const answers = clearCase();
    answers.supply = { ...answers.supply, mainFuseAmps: 60, loads: { showerKw: 10.5 } };
    const small = runChecks({ answers, uploads: photos, today: TODAY });
    expect(lightOf(small, 'supply-headroom')).toBe('red');
    expect(small.light).toBe('red');
    answers.supply = { ...answers.supply, mainFuseAmps: 100 };
    const large = runChecks({ answers, uploads: photos, today: TODAY });
    expect(lightOf(large, 'supply-headroom')).toBe('green');
    // The shower takes demand over 60 A, so the ENA route becomes apply-before (amber) and timing
    // adds 28 days: 60 − 49 = 11 spare ≥ 7 → timing stays green.
    expect(lightOf(large, 'network-operator')).toBe('amber');
    expect(lightOf(large, 'timing')).toBe('green');
  });

  it('fills partial settings with the defaults', () => {
    // A 16 A charger over 10 m: 2.5 mm² drops 19 × 16 × 10 / 1000 = 3.04 V.
    const result = runChecks({ answers: clearCase(), uploads: photos, settings: { chargerAmps: 16 }, today: TODAY });
    const cable = result.checks.find((check) => check.id === 'cable-run');
    expect((cable?.figures.sizes as { volts: number }[])[0]?.volts).toBeCloseTo(3.04, 3);
  });

  it('refuses a today that is not a date, since checks never read the clock', () => {
    expect(() => runChecks({ answers: {}, today: '3 March' })).toThrow(RangeError);
  });

  it('gives every result a title, both texts, a source, and actions exactly when not green', () => {
    const scenarios: ChecklistAnswers[] = [{}, clearCase(), { supply: { mainFuseAmps: 60, loads: { showerKw: 10.5 } }, parking: { kind: 'none' } }];
    for (const answers of scenarios) {
      for (const check of runChecks({ answers, uploads: photos, today: TODAY }).checks) {
        expect(check.title, check.id).not.toBe('');
        expect(check.customerText, check.id).not.toBe('');
        expect(check.staffText, check.id).not.toBe('');
        expect(check.source, check.id).toMatch(/BS 7671|IET|ENA|Energy Networks|MPAN|Common practice/);
        expect(check.light === 'green' ? check.actions.length === 0 : check.actions.length > 0, `${check.id} actions`).toBe(true);
      }
    }
  });
});

describe('settings', () => {
  it('has the documented defaults', () => {
    expect(defaultReadinessSettings).toMatchObject({
      nominalVoltage: 230,
      chargerAmps: 32,
      headroomMarginAmps: 10,
      baselineAmps: 10,
      surveyLeadDays: 7,
      installLeadDays: 14,
      supplyUpgradeLeadDays: 28,
      timingSlackDays: 7,
      nearSoftGroundMetres: 10,
      voltageDropLimitPercent: 5,
      longRunMetres: 15,
      notifyWithinDays: 28,
      enaDemandLimitAmps: 60,
      defaultCustomerCableMetres: 5,
    });
  });

  it('describes every setting for the admin page, with its default', () => {
    const keys = Object.keys(defaultReadinessSettings).sort();
    expect(Object.keys(settingDescriptions).sort()).toEqual(keys);
    for (const key of keys as (keyof typeof defaultReadinessSettings)[]) {
      expect(settingDescriptions[key].default).toBe(defaultReadinessSettings[key]);
      expect(settingDescriptions[key].label).not.toBe('');
      expect(settingDescriptions[key].source).not.toBe('');
    }
  });

  it('refuses nonsense values', () => {
    expect(readinessSettingsSchema.safeParse({ surveyLeadDays: -1 }).success).toBe(false);
    expect(readinessSettingsSchema.safeParse({ surveyLeadDays: 2.5 }).success).toBe(false);
    expect(readinessSettingsSchema.safeParse({ nominalVoltage: 0 }).success).toBe(false);
  });
});
