import { describe, expect, it } from 'vitest';
import { checkTiming, leadTime, timingLight, timingLightWithUnknowns } from '@/lib/readiness/checks/timing';
import { addDays, isoDayNumber } from '@/lib/readiness/dates';
import { defaultReadinessSettings, resolveReadinessSettings } from '@/lib/readiness/settings';
import type { LoadAnswers, Looped, SupplyAnswers } from '@/lib/readiness';

// Lead times are settings (common practice, no published source): survey 7 + install 14 = 21
// calendar days; + 28 when the network operator must be applied to first (ENA "Connecting
// electric vehicles and heat pumps"). Calendar days: weekends are not skipped. Slack 7 days.
// today = 2025-03-03 (a Monday).
const TODAY = '2025-03-03';
// 100 A, not looped, every load answered "none", one socket circuit, a 3.6 kW charger:
// 32 + 0.66 × 2000 / 230 + 16 = 53.74 A ≤ 60 A (IET OSG Table A2; ENA) → connect and notify.
const DECLARED: LoadAnswers = { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 1 };
const NOTIFY: SupplyAnswers = { mainFuseAmps: 100, looped: 'no', loads: DECLARED };
// A looped supply: apply first (known), + 28 days.
const APPLY: SupplyAnswers = { ...NOTIFY, looped: 'yes' };

function timing(deliveryDate: string | null, supply: SupplyAnswers = NOTIFY, today = TODAY) {
  return checkTiming({ answers: { vehicle: { deliveryDate }, supply, charger: { ratingKw: 3.6 } }, uploads: [], site: {}, settings: defaultReadinessSettings, today });
}

describe('calendar days', () => {
  it.each([
    // March has 31 days: 3 + 21 = 24 → 2025-03-24.
    { from: '2025-03-03', days: 21, to: '2025-03-24' },
    // 3 + 49 = 52 − 31 → 21 April.
    { from: '2025-03-03', days: 49, to: '2025-04-21' },
    // Leap year: 20 Feb 2024 + 21 = 41 − 29 → 12 March.
    { from: '2024-02-20', days: 21, to: '2024-03-12' },
    // Across the year end: 20 Dec + 21 = 41 − 31 → 10 January.
    { from: '2025-12-20', days: 21, to: '2026-01-10' },
  ])('$from + $days = $to', ({ from, days, to }) => {
    expect(addDays(from, days)).toBe(to);
  });

  it('refuses dates that do not exist', () => {
    expect(isoDayNumber('2025-02-29')).toBeNull();
    expect(isoDayNumber('2024-02-29')).not.toBeNull();
    expect(isoDayNumber('03/03/2025')).toBeNull();
  });

  it('does not skip weekends: a Saturday start lands on a Saturday 21 days on', () => {
    // 2025-03-08 is a Saturday; + 21 calendar days = 2025-03-29, also a Saturday.
    expect(timing('2025-06-01', NOTIFY, '2025-03-08').figures.earliestInstallDate).toBe('2025-03-29');
  });
});

describe('timing edges, notify-after (21 days lead)', () => {
  it.each([
    // Delivery exactly at the lead time: 21 − 21 = 0 spare → install on the day → amber (tight).
    { delivery: '2025-03-24', spare: 0, light: 'amber' },
    // One day short: 20 − 21 = −1 → red.
    { delivery: '2025-03-23', spare: -1, light: 'red' },
    // Tomorrow: 1 − 21 = −20 → red.
    { delivery: '2025-03-04', spare: -20, light: 'red' },
    // 27 days: 6 spare < 7 slack → amber.
    { delivery: '2025-03-30', spare: 6, light: 'amber' },
    // 28 days: 7 spare, not less than the slack → green.
    { delivery: '2025-03-31', spare: 7, light: 'green' },
  ])('delivery $delivery → spare $spare → $light', ({ delivery, spare, light }) => {
    const result = timing(delivery);
    expect(result.figures.spareDays).toBe(spare);
    expect(result.figures.totalLeadDays).toBe(21);
    expect(result.light).toBe(light);
  });

  it.each([
    // Delivery today: the car is here (or arrives today): amber "as soon as possible".
    { delivery: '2025-03-03' },
    // Delivered last week: also amber, nothing left to reschedule.
    { delivery: '2025-02-24' },
  ])('delivery $delivery (already here) → amber, as soon as possible', ({ delivery }) => {
    const result = timing(delivery);
    expect(result.light).toBe('amber');
    expect(result.actions[0]).toMatch(/as soon as possible/);
  });

  it.each([{ delivery: null }, { delivery: '2025-02-30' }])('delivery $delivery → amber, asks for the date', ({ delivery }) => {
    const result = timing(delivery);
    expect(result.light).toBe('amber');
    expect(result.actions).toEqual(['Enter the expected delivery date.']);
  });
});

describe('timing with a network-operator application (49 days lead)', () => {
  it.each([
    // 7 + 14 + 28 = 49: delivery 2025-04-21 → 0 spare → amber.
    { delivery: '2025-04-21', spare: 0, light: 'amber' },
    // One day short → red.
    { delivery: '2025-04-20', spare: -1, light: 'red' },
    // 2025-04-28: 56 − 49 = 7 spare → green.
    { delivery: '2025-04-28', spare: 7, light: 'green' },
    // A date that is green without the application (38 − 21 = 17) is red with it (38 − 49 = −11).
    { delivery: '2025-04-10', spare: -11, light: 'red' },
  ])('delivery $delivery → spare $spare → $light', ({ delivery, spare, light }) => {
    const result = timing(delivery, APPLY);
    expect(result.figures.supplyUpgradeLeadDays).toBe(28);
    expect(result.figures.networkRoute).toBe('apply-before');
    expect(result.figures.spareDays).toBe(spare);
    expect(result.light).toBe(light);
  });
});

describe('an unknown answer never turns timing red', () => {
  it.each([
    // Looped not known, delivery in 30 days (2025-04-02): known lead 21 → 9 spare; with the
    // possible network step 49 → −19. Red only for what is known: amber.
    { looped: 'unsure', delivery: '2025-04-02', light: 'amber' },
    { looped: null, delivery: '2025-04-02', light: 'amber' },
    // Known looped: the 49 days are certain → red.
    { looped: 'yes', delivery: '2025-04-02', light: 'red' },
    // Not looped: 21 days, 9 spare ≥ 7 → green.
    { looped: 'no', delivery: '2025-04-02', light: 'green' },
    // Looped unknown but delivery in 20 days: 20 − 21 = −1 even without the network step → red.
    { looped: 'unsure', delivery: '2025-03-23', light: 'red' },
  ] as const)('looped $looped, delivery $delivery → $light', ({ looped, delivery, light }) => {
    const result = timing(delivery, { ...NOTIFY, looped: looped as Looped | null });
    expect(result.light).toBe(light);
  });

  it('says in plain words that it may not fit, and why', () => {
    const result = timing('2025-04-02', { ...NOTIFY, looped: 'unsure' });
    expect(result.figures).toMatchObject({ spareDays: -19, knownSpareDays: 9, networkLeadKnown: false });
    expect(result.customerText).toMatch(/may not fit/);
    expect(result.staffText).toMatch(/Without the possible DNO step: spare 9 days/);
  });

  it.each([
    { worst: -19, known: 9, light: 'amber' },
    { worst: 3, known: 31, light: 'amber' },
    { worst: 7, known: 35, light: 'green' },
    { worst: -1, known: -1, light: 'red' },
  ] as const)('worst $worst, known $known → $light', ({ worst, known, light }) => {
    expect(timingLightWithUnknowns(worst, known, 7)).toBe(light);
  });
});

describe('lead time and light rules', () => {
  it('adds the lead times from settings', () => {
    expect(leadTime(defaultReadinessSettings, false).totalLeadDays).toBe(21);
    expect(leadTime(defaultReadinessSettings, true).totalLeadDays).toBe(49);
    // 3 + 5 + 10 = 18.
    expect(leadTime(resolveReadinessSettings({ surveyLeadDays: 3, installLeadDays: 5, supplyUpgradeLeadDays: 10 }), true).totalLeadDays).toBe(18);
  });

  it.each([
    { spare: -1, slack: 7, light: 'red' },
    { spare: 0, slack: 7, light: 'amber' },
    { spare: 6, slack: 7, light: 'amber' },
    { spare: 7, slack: 7, light: 'green' },
    // With no slack, a same-day install is green.
    { spare: 0, slack: 0, light: 'green' },
  ] as const)('spare $spare, slack $slack → $light', ({ spare, slack, light }) => {
    expect(timingLight(spare, slack)).toBe(light);
  });

  it('refuses a malformed today: the caller must pass the date', () => {
    expect(() => timing('2025-04-01', NOTIFY, 'today')).toThrow(RangeError);
  });
});

describe('nothing answered but the delivery date', () => {
  it('an unknown looped supply, loads and rating, delivery in 30 days: amber, not red', () => {
    // The least demand is one 32 A socket circuit + 5.74 A lighting + a 16 A (3.6 kW) charger =
    // 53.74 A ≤ 60 A (OSG Table A2; ENA), so the network step is only possible: 30 − 21 = 9 ≥ 0 → amber.
    const result = checkTiming({ answers: { vehicle: { deliveryDate: '2025-04-02' }, supply: { mainFuseAmps: 100, looped: 'unsure', loads: {} } }, uploads: [], site: {}, settings: defaultReadinessSettings, today: TODAY });
    expect(result.light).toBe('amber');
  });
});
