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
} from '@/lib/readiness';

const TODAY = '2025-03-03';

// A case every check should clear, worked check by check:
// - MPAN 1312345678907: the published worked example (sum 1349, mod 11 = 7).
// - 100 A cut-out, every load question answered "none", one socket circuit, a 3.6 kW charger:
//   OSG Table A2 (second-hand, The Electrician's Guide Table 6.2): sockets 32 A (100% of the
//   largest) + lighting 66% × 2000 / 230 = 5.739 A + 16 A charger (722.311) = 53.74 A → 46.26 A spare.
// - ENA: 53.74 A ≤ 60 A, within the cut-out, not looped → connect and notify.
// - TN-S earthing: 722.411.4.1's PME restriction does not apply.
// - 10 m through the wall, In 32 A: 2.5 mm² 28 A (4D4A method C, from memory) < 32 A; 4 mm²
//   38 A ≥ 32 A, drop 12 × 16 × 10 / 1000 = 1.92 V ≤ 11.5 V.
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
      phases: 'single',
      loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 1 },
    },
    parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
    charger: { cableRunMetres: 10, route: 'through-wall', softGround: false, preference: 'tethered', tetherMetres: 5, ratingKw: 3.6, plan },
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

  it('a 10.5 kW shower is over a 60 A and a 100 A cut-out by Table A2; a measured demand can clear it', () => {
    // One socket circuit 32 + lighting 5.739 + shower 10 500 / 230 = 45.652 + charger 16 = 99.39 A:
    // over 60 A → red; within 100 A with 0.61 A spare < 10 A margin → amber.
    const answers = clearCase();
    answers.supply = { ...answers.supply, mainFuseAmps: 60, loads: { ...answers.supply!.loads, showerKw: 10.5 } };
    const small = runChecks({ answers, uploads: photos, today: TODAY });
    expect(lightOf(small, 'supply-headroom')).toBe('red');
    expect(small.light).toBe('red');
    answers.supply = { ...answers.supply, mainFuseAmps: 100 };
    const large = runChecks({ answers, uploads: photos, today: TODAY });
    expect(lightOf(large, 'supply-headroom')).toBe('amber');
    // 99.39 A > 60 A: the ENA route is apply to connect (known), and timing adds 28 days:
    // 60 days − 49 = 11 spare ≥ 7 → timing stays green.
    expect(lightOf(large, 'network-operator')).toBe('amber');
    expect(lightOf(large, 'timing')).toBe('green');
    // A logger showing 30 A existing: 30 + 16 = 46 A → 54 A spare on 100 A, and ≤ 60 A → connect and notify.
    const measured = runChecks({ answers, uploads: photos, site: { measuredMaxDemandAmps: 30 }, today: TODAY });
    expect(lightOf(measured, 'supply-headroom')).toBe('green');
    expect(lightOf(measured, 'network-operator')).toBe('green');
  });

  it('a half-answered loads question is never green', () => {
    const answers = clearCase();
    answers.supply = { ...answers.supply, loads: { cooker: false } };
    const result = runChecks({ answers, uploads: photos, today: TODAY });
    expect(lightOf(result, 'supply-headroom')).toBe('amber');
    expect(lightOf(result, 'network-operator')).toBe('amber');
  });

  it('PME with soft ground near is amber until the measure is recorded', () => {
    const answers = clearCase();
    answers.supply = { ...answers.supply, earthing: 'pme' };
    answers.charger = { ...answers.charger, softGround: true, softGroundMetres: 3 };
    expect(lightOf(runChecks({ answers, uploads: photos, today: TODAY }), 'earthing')).toBe('amber');
    expect(lightOf(runChecks({ answers, uploads: photos, site: { earthingMeasure: 'open-pen-device' }, today: TODAY }), 'earthing')).toBe('green');
  });

  it('an unknown looped supply with delivery in 30 days is amber, not red', () => {
    // Known lead 21 days → 9 spare; the possible network step would make it −19: amber.
    const answers = clearCase();
    answers.supply = { ...answers.supply, looped: 'unsure' };
    answers.vehicle = { ...answers.vehicle, deliveryDate: '2025-04-02' };
    const result = runChecks({ answers, uploads: photos, today: TODAY });
    expect(lightOf(result, 'timing')).toBe('amber');
    expect(result.light).toBe('amber');
  });

  it('fills partial settings with the defaults', () => {
    // A 40 A device: 4 mm² 38 A < 40 A, so 6 mm² (49 A); drop 7.9 × 16 × 10 / 1000 = 1.264 V.
    const result = runChecks({ answers: clearCase(), uploads: photos, settings: { protectiveDeviceAmps: 40 }, today: TODAY });
    const cable = result.checks.find((check) => check.id === 'cable-run');
    expect(cable?.figures.recommendedCsaMm2).toBe(6);
    expect((cable?.figures.sizes as { csaMm2: number; volts: number }[]).find((r) => r.csaMm2 === 6)?.volts).toBeCloseTo(1.264, 3);
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
      socketCircuitAmps: 32,
      assumedSocketCircuits: 2,
      lightingKw: 2,
      protectiveDeviceAmps: 32,
      terminalTemperatureC: 70,
      upstreamDropPercent: 0,
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
