import { describe, expect, it } from 'vitest';
import { CABLE_SIZES, TABLE_4E4B_25MM2 } from '@/lib/readiness/cable-tables';
import { cableDesign, cableSizeRows, checkCableRun, recommendedCsaMm2, type CableSizeRow, type CorrectionFactor } from '@/lib/readiness/checks/cable-run';
import { resolveReadinessSettings } from '@/lib/readiness/settings';
import type { CableRoute, ChecklistAnswers, ReadinessSettingsInput } from '@/lib/readiness';

// Sizing rule: Ib ≤ In ≤ Iz (BS 7671:2018+A2:2022 Regulation 433.1.1). Iz is the tabulated
// capacity It times the correction factors for the route. Terminals are taken at 70 °C unless
// declared for 90 °C (Regulation 512.1.5 and the notes to the 90 °C tables), so a 90 °C cable
// is sized on the 70 °C ratings.
//
// Values used below, by table and column:
// - Table 4D4A (70 °C armoured), 2-core, reference method C — from memory, not seen in the source:
//   2.5 mm² 28 A, 4 mm² 38 A, 6 mm² 49 A, 10 mm² 67 A, 16 mm² 89 A, 25 mm² 118 A.
// - Table 4D4A, 2-core, reference method D (buried) — from memory: 2.5 29, 4 37, 6 46, 10 60 A.
// - Table 4E4A (90 °C armoured), 2-core, method C (from the trade reference): 36, 49, 62, 85, 110, 146 A.
// - Table 4E4B (90 °C), 2-core single-phase mV/A/m (trade reference): 19, 12, 7.9, 4.7, 2.9;
//   25 mm² r 1.85, x 0.160 → z = √(1.85² + 0.160²) = √3.4481 = 1.857 → 1.86.
// - Regulation 523.9: a cable surrounded by thermal insulation over 0.5 m takes half its
//   clipped-direct rating.
// Voltage drop V = mV/A/m × Ib × L / 1000; limit 5% of 230 V = 11.5 V (Appendix 4 section 6.4,
// Table 4Ab), less any upstream drop.

function answers(cableRunMetres: number | null, route: CableRoute | null, ratingKw: number | null = 7.4): ChecklistAnswers {
  return { charger: { cableRunMetres, route, ratingKw } };
}

function run(cableRunMetres: number | null, route: CableRoute | null = 'along-wall', settings: ReadinessSettingsInput = {}, ratingKw: number | null = 7.4) {
  return checkCableRun({ answers: answers(cableRunMetres, route, ratingKw), uploads: [], site: {}, settings: resolveReadinessSettings(settings), today: '2025-03-03' });
}

function rowsFor(metres: number, route: CableRoute | null, settings: ReadinessSettingsInput = {}, ratingKw: number | null = 7.4): CableSizeRow[] {
  return cableSizeRows(cableDesign(answers(metres, route, ratingKw), resolveReadinessSettings(settings)), metres);
}

const at = (rows: CableSizeRow[], csa: number) => rows.find((r) => r.csaMm2 === csa)!;

describe('the 25 mm² row of Table 4E4B agrees with its own r and x', () => {
  it('z = √(r² + x²) to the table’s three figures', () => {
    // √(1.85² + 0.160²) = √(3.4225 + 0.0256) = √3.4481 = 1.8569 → 1.86 (the earlier 1.90 did not agree).
    const { r, x } = TABLE_4E4B_25MM2;
    expect(Math.round(Math.hypot(r, x) * 100) / 100).toBe(1.86);
    expect(CABLE_SIZES.find((s) => s.csaMm2 === 25)!.mvPerAPerM[1]).toBe(1.86);
  });

  it('25 mm² over 20 m at 32 A: 1.86 × 32 × 20 / 1000 = 1.190 V', () => {
    expect(at(rowsFor(20, 'along-wall'), 25).volts).toBeCloseTo(1.19, 3);
  });
});

describe('32 A charge point on a 32 A device, clipped direct, 70 °C terminals (the default)', () => {
  it.each([
    // 2.5 mm²: It 28 A (4D4A col. C) < In 32 A → fails at every length.
    // 4 mm²: 38 A ≥ 32 A; drop 12 × 32 × L / 1000 = 1.92 V (5 m), 3.84 V (10 m), 7.68 V (20 m), 11.52 V (30 m > 11.5 V).
    // 6 mm² at 30 m: 7.9 × 32 × 30 / 1000 = 7.584 V ≤ 11.5 V.
    { metres: 5, recommended: 4 },
    { metres: 10, recommended: 4 },
    { metres: 20, recommended: 4 },
    { metres: 30, recommended: 6 },
  ])('$metres m → $recommended mm², never 2.5 mm²', ({ metres, recommended }) => {
    const rows = rowsFor(metres, 'along-wall');
    expect(at(rows, 2.5).capacityAmps).toBe(28);
    expect(at(rows, 2.5).passesCapacity).toBe(false);
    expect(recommendedCsaMm2(rows)).toBe(recommended);
  });

  it('4 mm² at 30 m fails the drop by 0.02 V: 11.52 V against 11.5 V', () => {
    const row = at(rowsFor(30, 'along-wall'), 4);
    expect(row.volts).toBeCloseTo(11.52, 3);
    expect(row.passesDrop).toBe(false);
  });
});

describe('never a size whose corrected capacity is below In', () => {
  it.each([
    // 40 A device: 4 mm² 38 A < 40 A → 6 mm² (49 A) at 10 m.
    { route: 'along-wall', device: 40, metres: 10, recommended: 6 },
    // Through the house (523.9, half the method C rating): 4 mm² 19 A, 6 mm² 24.5 A, 10 mm² 33.5 A ≥ 32 A → 10 mm².
    { route: 'through-house', device: 32, metres: 10, recommended: 10 },
    // ... and on a 40 A device: 10 mm² 33.5 A < 40 A; 16 mm² 44.5 A → 16 mm².
    { route: 'through-house', device: 40, metres: 10, recommended: 16 },
    // Buried, method D (4D4A, from memory): 4 mm² 37 A ≥ 32 A → 4 mm² at 10 m.
    { route: 'buried', device: 32, metres: 10, recommended: 4 },
    // Buried on 40 A: 4 mm² 37 A < 40 A; 6 mm² 46 A → 6 mm².
    { route: 'buried', device: 40, metres: 10, recommended: 6 },
  ] as const)('$route on $device A over $metres m → $recommended mm²', ({ route, device, metres, recommended }) => {
    const rows = rowsFor(metres, route, { protectiveDeviceAmps: device });
    const chosen = recommendedCsaMm2(rows);
    expect(chosen).toBe(recommended);
    expect(at(rows, chosen!).capacityAmps).toBeGreaterThanOrEqual(device);
  });

  it('an unknown route is sized for the worst listed route (through insulation)', () => {
    // Same as through the house: 10 mm² at 33.5 A.
    expect(recommendedCsaMm2(rowsFor(10, null))).toBe(10);
  });

  it('with terminals declared for 90 °C, 4E4A applies: 2.5 mm² 36 A ≥ 32 A at 5 m (19 × 32 × 5 / 1000 = 3.04 V)', () => {
    expect(recommendedCsaMm2(rowsFor(5, 'along-wall', { terminalTemperatureC: 90 }))).toBe(2.5);
    // But not on a 40 A device: 36 A < 40 A → 4 mm² (49 A).
    expect(recommendedCsaMm2(rowsFor(5, 'along-wall', { terminalTemperatureC: 90, protectiveDeviceAmps: 40 }))).toBe(4);
  });
});

describe('partial charge-point loads and the upstream allowance', () => {
  it('a 3.6 kW (16 A) charge point still needs Iz ≥ In 32 A: 4 mm² over 20 m (12 × 16 × 20 / 1000 = 3.84 V)', () => {
    const rows = rowsFor(20, 'along-wall', {}, 3.6);
    expect(at(rows, 4).volts).toBeCloseTo(3.84, 3);
    expect(recommendedCsaMm2(rows)).toBe(4);
  });

  it('an upstream drop of 2% leaves 3% of 230 V = 6.9 V: 4 mm² at 20 m (7.68 V) fails, 6 mm² (5.056 V) passes', () => {
    const result = run(20, 'along-wall', { upstreamDropPercent: 2 });
    expect(result.figures.limitVolts).toBe(6.9);
    expect(result.figures.recommendedCsaMm2).toBe(6);
  });

  it('the default upstream allowance is 0%: the limit counts from the origin, where the consumer unit usually is', () => {
    expect(run(20).figures.upstreamPercent).toBe(0);
    expect(run(20).figures.limitVolts).toBe(11.5);
  });

  it('an 11 kW charge point is three phase at 16 A a line: 5% of 230 × √3 = 19.92 V', () => {
    const result = run(20, 'along-wall', {}, 11);
    expect(result.figures.phases).toBe(3);
    expect(result.figures.currentAmps).toBe(16);
    expect(result.figures.limitVolts).toBeCloseTo(19.919, 2);
  });
});

describe('cable-run light and working', () => {
  it.each([
    { metres: 10, route: 'through-wall', light: 'green' },
    { metres: 10, route: 'along-wall', light: 'green' },
    // Through the house or buried: extra cost (common practice) → amber.
    { metres: 10, route: 'through-house', light: 'amber' },
    { metres: 10, route: 'buried', light: 'amber' },
    // Exactly the 15 m threshold is not "longer than" → green; 15.5 m → amber.
    { metres: 15, route: 'along-wall', light: 'green' },
    { metres: 15.5, route: 'along-wall', light: 'amber' },
    { metres: 10, route: null, light: 'amber' },
    // 200 m buried: 25 mm² drops 1.86 × 32 × 200 / 1000 = 11.9 V > 11.5 V → nothing passes → red.
    { metres: 200, route: 'buried', light: 'red' },
    { metres: null, route: 'through-wall', light: 'amber' },
  ] as const)('$metres m $route → $light', ({ metres, route, light }) => {
    expect(run(metres, route).light).toBe(light);
  });

  it('stays amber while the charge point rating is only assumed', () => {
    expect(run(10, 'along-wall', {}, null).light).toBe('amber');
    expect(run(10, 'along-wall', {}, null).actions.join(' ')).toMatch(/rating/);
  });

  it('shows the device, method and factors it used', () => {
    const buried = run(10, 'buried');
    expect(buried.figures.deviceAmps).toBe(32);
    expect(buried.figures.method).toBe('D');
    expect(buried.figures.terminalTemperatureC).toBe(70);
    expect((buried.figures.factors as CorrectionFactor[]).map((f) => f.basis).join(' ')).toMatch(/4B2.*4B3/);
    const indoors = run(10, 'through-house');
    expect(indoors.figures.factor).toBe(0.5);
    expect(indoors.staffText).toMatch(/In 32 A/);
    expect(indoors.staffText).toMatch(/523\.9|insulation/);
  });

  it('refuses a charger current setting that is not a real rating', () => {
    expect(() => resolveReadinessSettings({ chargerAmps: 20 as 16 })).toThrow();
    expect(() => resolveReadinessSettings({ protectiveDeviceAmps: 45 as 40 })).toThrow();
  });
});
