import { describe, expect, it } from 'vitest';
import { checkEarthing, electrodeGround, electrodeTest } from '@/lib/readiness/checks/earthing';
import { defaultReadinessSettings } from '@/lib/readiness/settings';
import type { Earthing, ParkingKind, SiteMeasures } from '@/lib/readiness';

// BS 7671:2018+A2:2022 722.411.4.1: PME not to be used for an outdoor charging point unless a
// listed measure applies (earth electrode keeping ≤ 70 V on a broken PEN, a device disconnecting
// within 5 s above 70 V rms, a balanced three-phase installation; later amendments add voltage
// monitoring). Soft ground only says whether an electrode is practical: PME stays amber until
// staff record the measure. TT: RA × IΔn ≤ 50 V (411.5.3); above 200 Ω may not be stable (Table
// 41.5 Note 2, as the trade reference notes; treated as common practice). RCD per
// 722.531.3.101. "Near" soft ground: within 10 m (setting, common practice, no published source).

function earthing(type: Earthing | null, softGround: boolean | null, softGroundMetres: number | null, kind: ParkingKind = 'attached-drive', site: SiteMeasures = {}) {
  return checkEarthing({
    answers: { supply: { earthing: type }, charger: { softGround, softGroundMetres }, parking: { kind } },
    uploads: [],
    site,
    settings: defaultReadinessSettings,
    today: '2025-03-03',
  });
}

describe('soft ground for an electrode', () => {
  it.each([
    { soft: true, metres: 0, ground: 'near' },
    { soft: true, metres: 3, ground: 'near' },
    // Exactly 10 m counts as near (≤ threshold).
    { soft: true, metres: 10, ground: 'near' },
    { soft: true, metres: 10.5, ground: 'far' },
    { soft: true, metres: null, ground: 'distance-unknown' },
    { soft: false, metres: 3, ground: 'none' },
    { soft: null, metres: null, ground: 'unknown' },
  ] as const)('soft $soft at $metres m → $ground', ({ soft, metres, ground }) => {
    expect(electrodeGround(soft, metres, 10)).toBe(ground);
  });
});

describe('earthing combinations', () => {
  it.each([
    // TN-S: the PME restriction of 722.411.4.1 does not apply → green, no measure.
    { type: 'tns', soft: null, metres: null, light: 'green', measureNeeded: false },
    // TT: an electrode exists but RA and IΔn are not recorded yet → amber.
    { type: 'tt', soft: false, metres: null, light: 'amber', measureNeeded: false },
    // PME with soft ground 3 m away: an electrode is practical, but no measure is chosen → amber.
    { type: 'pme', soft: true, metres: 3, light: 'amber', measureNeeded: true },
    { type: 'pme', soft: true, metres: 10, light: 'amber', measureNeeded: true },
    // PME, soft ground 12 m away: too far to count as near → amber (open-PEN device likely).
    { type: 'pme', soft: true, metres: 12, light: 'amber', measureNeeded: true },
    // PME, soft ground, distance not given → amber.
    { type: 'pme', soft: true, metres: null, light: 'amber', measureNeeded: true },
    // PME, no soft ground → open-PEN device still to settle → amber.
    { type: 'pme', soft: false, metres: null, light: 'amber', measureNeeded: true },
    // PME, soft ground not answered → amber.
    { type: 'pme', soft: null, metres: null, light: 'amber', measureNeeded: true },
    // Unknown earthing: treated as PME and amber even with soft ground near.
    { type: 'unknown', soft: true, metres: 3, light: 'amber', measureNeeded: true },
    { type: null, soft: null, metres: null, light: 'amber', measureNeeded: true },
  ] as const)('$type, soft $soft $metres m → $light', ({ type, soft, metres, light, measureNeeded }) => {
    const result = earthing(type, soft, metres);
    expect(result.light).toBe(light);
    expect(result.figures.measureNeeded).toBe(measureNeeded);
    expect(result.staffText).toContain('722.531.3.101');
    expect(light === 'green' ? result.actions.length === 0 : result.actions.length > 0).toBe(true);
  });

  it('gives the TT resistance limits: 50 V / 0.03 A = 1666.7 Ω, 200 Ω for stability', () => {
    const result = earthing('tt', null, null, 'attached-drive', { electrodeOhms: 100, rcdIdnMilliamps: 30 });
    expect(result.figures).toMatchObject({ ttMaxRaOhms: 1667, ttStableRaOhms: 200 });
    expect(result.staffText).toMatch(/411\.5\.3/);
  });

  it('names the PME measures and the distance in the working', () => {
    const result = earthing('pme', true, 12);
    expect(result.staffText).toMatch(/722\.411\.4\.1/);
    expect(result.staffText).toMatch(/open-PEN/);
    expect(result.staffText).toContain('12 m');
    expect(result.actions.join(' ')).toMatch(/open-PEN/);
    expect(result.customerText).toMatch(/don't remove any covers/);
  });

  it('flags garage parking for the surveyor to confirm outdoor use', () => {
    const result = earthing('pme', false, null, 'garage');
    expect(result.figures.outdoorUse).toBe('possibly');
    expect(result.staffText).toMatch(/Garage/);
  });
});

describe('PME stays amber until the 722.411.4.1 measure is recorded', () => {
  it.each([
    // Soft ground 3 m away and nothing recorded: amber however practical an electrode is.
    { measure: null, light: 'amber' },
    { measure: 'open-pen-device', light: 'green' },
    { measure: 'installation-electrode', light: 'green' },
    { measure: 'other-listed', light: 'green' },
    // A balanced three-phase installation on a supply not recorded as three phase: check → amber.
    { measure: 'balanced-three-phase', light: 'amber' },
    // TT electrode for the charging point: needs RA and IΔn before it is green.
    { measure: 'tt-electrode', light: 'amber' },
  ] as const)('PME, soft ground at 3 m, measure $measure → $light', ({ measure, light }) => {
    const result = earthing('pme', true, 3, 'attached-drive', measure ? { earthingMeasure: measure } : {});
    expect(result.light).toBe(light);
    if (measure === null) expect(result.actions.join(' ')).toMatch(/record the 722\.411\.4\.1 measure/);
  });

  it('shows the measure in the working', () => {
    const result = earthing('pme', false, null, 'attached-drive', { earthingMeasure: 'open-pen-device' });
    expect(result.figures.earthingMeasure).toBe('open-pen-device');
    expect(result.staffText).toMatch(/Measure recorded: .*open-PEN/);
    expect(result.customerText).not.toMatch(/722|PEN/);
  });
});

describe('TT electrode: RA × IΔn ≤ 50 V (BS 7671 411.5.3), RA above 200 Ω possibly unstable', () => {
  it.each([
    // 100 Ω × 0.030 A = 3 V ≤ 50 V, and ≤ 200 Ω → green.
    { ra: 100, volts: 3, light: 'green' },
    // 250 Ω × 0.030 A = 7.5 V ≤ 50 V, but above 200 Ω: may not be stable → amber.
    { ra: 250, volts: 7.5, light: 'amber' },
    // 1800 Ω × 0.030 A = 54 V > 50 V → fails 411.5.3 → red (known to block).
    { ra: 1800, volts: 54, light: 'red' },
    // The edge: 1666 Ω × 0.030 = 49.98 V passes the touch-voltage rule, but is above 200 Ω → amber.
    { ra: 1666, volts: 49.98, light: 'amber' },
  ])('RA $ra Ω at 30 mA → $volts V → $light', ({ ra, volts, light }) => {
    expect(electrodeTest(ra, 30).touchVolts).toBeCloseTo(volts, 3);
    expect(earthing('tt', null, null, 'attached-drive', { electrodeOhms: ra, rcdIdnMilliamps: 30 }).light).toBe(light);
    // The same electrode made for the charge point on a PME supply gives the same light.
    expect(earthing('pme', true, 2, 'attached-drive', { earthingMeasure: 'tt-electrode', electrodeOhms: ra, rcdIdnMilliamps: 30 }).light).toBe(light);
  });

  it('RA without IΔn is not enough: amber, asking for both', () => {
    const result = earthing('tt', null, null, 'attached-drive', { electrodeOhms: 100 });
    expect(result.light).toBe('amber');
    expect(result.actions.join(' ')).toMatch(/IΔn/);
  });

  it('a 100 mA RCD needs RA ≤ 500 Ω: 600 Ω × 0.1 A = 60 V fails', () => {
    expect(electrodeTest(600, 100)).toMatchObject({ touchVolts: 60, passes: false });
  });
});
