import { describe, expect, it } from 'vitest';
import { checkEarthing, electrodeGround, TT_MAX_RA_OHMS_30MA } from '../../src/lib/readiness/checks/earthing';
import { defaultReadinessSettings } from '../../src/lib/readiness/settings';
import type { Earthing, ParkingKind } from '../../src/lib/readiness';

// BS 7671:2018+A2:2022 722.411.4.1: PME not to be used for an outdoor charging point without an
// earth electrode or an open-PEN device. TT: RA × IΔn ≤ 50 V (411.5.3); above 200 Ω may not be
// stable (Table 41.5 Note 2). RCD per 722.531.3.101. "Near" soft ground: within 10 m (setting,
// common practice, no published source).

function earthing(type: Earthing | null, softGround: boolean | null, softGroundMetres: number | null, kind: ParkingKind = 'attached-drive') {
  return checkEarthing({
    answers: { supply: { earthing: type }, charger: { softGround, softGroundMetres }, parking: { kind } },
    uploads: [],
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
    // TT: an electrode already exists; RA to be tested → green.
    { type: 'tt', soft: false, metres: null, light: 'green', measureNeeded: false },
    // PME with soft ground 3 m away: electrode practical → green.
    { type: 'pme', soft: true, metres: 3, light: 'green', measureNeeded: true },
    { type: 'pme', soft: true, metres: 10, light: 'green', measureNeeded: true },
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
    expect(TT_MAX_RA_OHMS_30MA).toBeCloseTo(1666.67, 2);
    const result = earthing('tt', null, null);
    expect(result.figures).toMatchObject({ ttMaxRaOhms: 1667, ttStableRaOhms: 200 });
    expect(result.staffText).toMatch(/411\.5\.3/);
    expect(result.staffText).toMatch(/Table 41\.5 Note 2/);
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
