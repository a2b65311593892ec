import { describe, expect, it } from 'vitest';
import { TABLE_4E4, voltageDropVolts } from '../../src/lib/readiness/cable-tables';
import {
  cableSizeRows,
  checkCableRun,
  recommendedCsaMm2,
  reference70CRows,
  type CableSizeRow,
} from '../../src/lib/readiness/checks/cable-run';
import { defaultReadinessSettings, resolveReadinessSettings } from '../../src/lib/readiness/settings';
import type { CableRoute, ReadinessSettingsInput } from '../../src/lib/readiness';

// Voltage drop V = (mV/A/m) × I × L / 1000 (BS 7671:2018+A2:2022 Appendix 4), with mV/A/m from
// Table 4E4B (2-core armoured copper, 90 °C thermosetting, single-phase AC): 2.5 mm² 19, 4 mm² 12,
// 6 mm² 7.9, 10 mm² 4.7, 16 mm² 2.9, 25 mm² 1.90. Limit 5% of 230 V = 11.5 V (Table 4Ab).
// Capacity, Table 4E4A method C (clipped direct): 36 / 49 / 62 / 85 / 110 / 146 A.

function run(cableRunMetres: number | null, route: CableRoute | null = 'through-wall', settings: ReadinessSettingsInput = {}) {
  return checkCableRun({
    answers: { charger: { cableRunMetres, route } },
    uploads: [],
    settings: resolveReadinessSettings(settings),
    today: '2025-03-03',
  });
}

function row(rows: CableSizeRow[], csaMm2: number): CableSizeRow {
  const found = rows.find((r) => r.csaMm2 === csaMm2);
  if (!found) throw new Error(`no row for ${csaMm2} mm²`);
  return found;
}

describe('the Table 4E4B / 4E4A values as published', () => {
  it('lists the six candidate sizes with their mV/A/m and method C capacity', () => {
    expect(TABLE_4E4.map((s) => [s.csaMm2, s.mvPerAPerM, s.capacityAmps])).toEqual([
      [2.5, 19, 36],
      [4, 12, 49],
      [6, 7.9, 62],
      [10, 4.7, 85],
      [16, 2.9, 110],
      [25, 1.9, 146],
    ]);
  });
});

describe('voltage drop at 32 A (Table 4E4B, 90 °C)', () => {
  it.each([
    // 6 mm²: 7.9 × 32 × 10 / 1000 = 2.528 V; 2.528 / 230 = 1.099%.
    { csa: 6, metres: 10, volts: 2.528, percent: 1.099, passesDrop: true },
    // 6 mm²: 7.9 × 32 × 20 / 1000 = 5.056 V; 5.056 / 230 = 2.198%.
    { csa: 6, metres: 20, volts: 5.056, percent: 2.198, passesDrop: true },
    // 6 mm²: 7.9 × 32 × 30 / 1000 = 7.584 V; 7.584 / 230 = 3.297%.
    { csa: 6, metres: 30, volts: 7.584, percent: 3.297, passesDrop: true },
    // 6 mm²: 7.9 × 32 × 45 / 1000 = 11.376 V; 4.946% — just inside 11.5 V.
    { csa: 6, metres: 45, volts: 11.376, percent: 4.946, passesDrop: true },
    // 6 mm²: 7.9 × 32 × 50 / 1000 = 12.64 V; 5.496% > 5% → fails.
    { csa: 6, metres: 50, volts: 12.64, percent: 5.496, passesDrop: false },
    // 10 mm²: 4.7 × 32 × 10 / 1000 = 1.504 V; 0.654%.
    { csa: 10, metres: 10, volts: 1.504, percent: 0.654, passesDrop: true },
    // 10 mm²: 4.7 × 32 × 20 / 1000 = 3.008 V; 1.308%.
    { csa: 10, metres: 20, volts: 3.008, percent: 1.308, passesDrop: true },
    // 10 mm²: 4.7 × 32 × 30 / 1000 = 4.512 V; 1.962%.
    { csa: 10, metres: 30, volts: 4.512, percent: 1.962, passesDrop: true },
    // 10 mm²: 4.7 × 32 × 50 / 1000 = 7.52 V; 3.270%.
    { csa: 10, metres: 50, volts: 7.52, percent: 3.27, passesDrop: true },
    // 10 mm²: 4.7 × 32 × 100 / 1000 = 15.04 V; 6.539% → fails.
    { csa: 10, metres: 100, volts: 15.04, percent: 6.539, passesDrop: false },
    // 16 mm²: 2.9 × 32 × 10 / 1000 = 0.928 V; 0.403%.
    { csa: 16, metres: 10, volts: 0.928, percent: 0.403, passesDrop: true },
    // 16 mm²: 2.9 × 32 × 20 / 1000 = 1.856 V; 0.807%.
    { csa: 16, metres: 20, volts: 1.856, percent: 0.807, passesDrop: true },
    // 16 mm²: 2.9 × 32 × 30 / 1000 = 2.784 V; 1.210%.
    { csa: 16, metres: 30, volts: 2.784, percent: 1.21, passesDrop: true },
    // 16 mm²: 2.9 × 32 × 100 / 1000 = 9.28 V; 4.035%.
    { csa: 16, metres: 100, volts: 9.28, percent: 4.035, passesDrop: true },
    // 2.5 mm²: 19 × 32 × 20 / 1000 = 12.16 V; 5.287% → fails the drop.
    { csa: 2.5, metres: 20, volts: 12.16, percent: 5.287, passesDrop: false },
    // 4 mm²: 12 × 32 × 30 / 1000 = 11.52 V; 5.009% → fails by 0.02 V.
    { csa: 4, metres: 30, volts: 11.52, percent: 5.009, passesDrop: false },
    // 25 mm²: 1.90 × 32 × 20 / 1000 = 1.216 V; 0.529%.
    { csa: 25, metres: 20, volts: 1.216, percent: 0.529, passesDrop: true },
  ])('$csa mm² over $metres m: $volts V, $percent%', ({ csa, metres, volts, percent, passesDrop }) => {
    const r = row(cableSizeRows(32, metres, defaultReadinessSettings), csa);
    expect(r.volts).toBeCloseTo(volts, 3);
    expect(r.percent).toBeCloseTo(percent, 3);
    expect(r.passesDrop).toBe(passesDrop);
  });

  it('puts the 2.5 mm² limit at 11.5 V / (19 × 32 / 1000) = 18.91 m', () => {
    // 18.9 m: 19 × 32 × 18.9 / 1000 = 11.4912 V ≤ 11.5 → passes; 19 m: 11.552 V → fails.
    expect(row(cableSizeRows(32, 18.9, defaultReadinessSettings), 2.5).passesDrop).toBe(true);
    expect(row(cableSizeRows(32, 19, defaultReadinessSettings), 2.5).passesDrop).toBe(false);
    expect(voltageDropVolts(19, 32, 18.9)).toBeCloseTo(11.4912, 4);
  });
});

describe('current-carrying capacity (Table 4E4A, method C) and the recommendation', () => {
  it.each([
    // 32 A: 2.5 mm² carries 36 A ≥ 32 A → passes capacity; at 10 m it drops 19 × 32 × 10 / 1000
    // = 6.08 V (2.643%) → passes both → 2.5 mm².
    { amps: 32, metres: 10, capacity25: true, drop25: true, recommended: 2.5 },
    // 32 A over 20 m: 2.5 mm² passes capacity (36 ≥ 32) but fails drop (12.16 V) → 4 mm²
    // (12 × 32 × 20 / 1000 = 7.68 V, 3.339%; 49 A ≥ 32 A).
    { amps: 32, metres: 20, capacity25: true, drop25: false, recommended: 4 },
    // 32 A over 30 m: 4 mm² fails by 0.02 V (11.52 V) → 6 mm² (7.584 V).
    { amps: 32, metres: 30, capacity25: true, drop25: false, recommended: 6 },
    // 32 A over 50 m: 6 mm² 12.64 V fails → 10 mm² (7.52 V).
    { amps: 32, metres: 50, capacity25: true, drop25: false, recommended: 10 },
    // 32 A over 100 m: 10 mm² 15.04 V fails → 16 mm² (9.28 V).
    { amps: 32, metres: 100, capacity25: true, drop25: false, recommended: 16 },
    // 40 A over 10 m: 2.5 mm² drops 19 × 40 × 10 / 1000 = 7.6 V (passes) but carries only
    // 36 A < 40 A → rejected on capacity → 4 mm² (49 A; 12 × 40 × 10 / 1000 = 4.8 V).
    { amps: 40, metres: 10, capacity25: false, drop25: true, recommended: 4 },
    // 36 A over 5 m: 36 A ≥ 36 A is just enough; 19 × 36 × 5 / 1000 = 3.42 V → 2.5 mm².
    { amps: 36, metres: 5, capacity25: true, drop25: true, recommended: 2.5 },
    // 32 A over 200 m: 25 mm² drops 1.90 × 32 × 200 / 1000 = 12.16 V > 11.5 V → none passes.
    { amps: 32, metres: 200, capacity25: true, drop25: false, recommended: null },
  ])('$amps A over $metres m → $recommended mm²', ({ amps, metres, capacity25, drop25, recommended }) => {
    const rows = cableSizeRows(amps, metres, defaultReadinessSettings);
    expect(row(rows, 2.5).passesCapacity).toBe(capacity25);
    expect(row(rows, 2.5).passesDrop).toBe(drop25);
    expect(recommendedCsaMm2(rows)).toBe(recommended);
  });

  it('never recommends from the 70 °C values, which are from memory', () => {
    // 19.5 m: 4E4B 2.5 mm² 19 × 32 × 19.5 / 1000 = 11.856 V (fails); the 4D4B value from memory,
    // 18 × 32 × 19.5 / 1000 = 11.232 V, would pass — but the recommendation stays 4 mm².
    const result = run(19.5);
    expect(result.figures.recommendedCsaMm2).toBe(4);
    const reference = result.figures.reference70C as { fromMemory: boolean; sizes: { csaMm2: number; volts: number }[] };
    expect(reference.fromMemory).toBe(true);
    expect(reference.sizes.find((s) => s.csaMm2 === 2.5)?.volts).toBeCloseTo(11.232, 3);
    // 6 mm² from memory: 7.3 × 32 × 20 / 1000 = 4.672 V.
    expect(reference70CRows(32, 20, defaultReadinessSettings).find((s) => s.csaMm2 === 6)?.volts).toBeCloseTo(4.672, 3);
  });
});

describe('cable-run light', () => {
  it.each([
    // 10 m straight through the wall: 2.5 mm² passes, short and simple → green.
    { metres: 10, route: 'through-wall', light: 'green' },
    { metres: 10, route: 'along-wall', light: 'green' },
    // Through the house or buried: extra cost (common practice) → amber.
    { metres: 10, route: 'through-house', light: 'amber' },
    { metres: 10, route: 'buried', light: 'amber' },
    // Exactly the 15 m threshold is not "longer than" → green; 15.5 m → amber.
    { metres: 15, route: 'along-wall', light: 'green' },
    { metres: 15.5, route: 'along-wall', light: 'amber' },
    // Route not chosen yet → amber.
    { metres: 10, route: null, light: 'amber' },
    // 200 m: no size passes → red.
    { metres: 200, route: 'buried', light: 'red' },
    // Length unknown → amber, nothing computed.
    { metres: null, route: 'through-wall', light: 'amber' },
  ] as const)('$metres m $route → $light', ({ metres, route, light }) => {
    expect(run(metres, route).light).toBe(light);
  });

  it('reports the working and the table it used', () => {
    const result = run(20);
    expect(result.figures.limitVolts).toBe(11.5);
    expect(result.figures.currentAmps).toBe(32);
    expect(result.figures.table).toMatch(/4E4B/);
    expect((result.figures.sizes as CableSizeRow[]).length).toBe(6);
    expect(result.staffText).toMatch(/6 mm² 5\.056 V \(2\.198%\)/);
    expect(result.source).toMatch(/Table 4Ab/);
  });

  it('uses the settings: a 3% limit makes 20 m of 4 mm² fail', () => {
    // 3% of 230 V = 6.9 V; 4 mm² at 20 m drops 7.68 V → fails; 6 mm² 5.056 V → passes.
    expect(run(20, 'through-wall', { voltageDropLimitPercent: 3 }).figures.recommendedCsaMm2).toBe(6);
  });

  it('asks for the length when it is missing', () => {
    const result = run(null);
    expect(result.figures.sizes).toEqual([]);
    expect(result.actions[0]).toMatch(/length/);
  });

  it('tells the customer once why a route may cost more', () => {
    // 22 m buried: both a costly route and longer than 15 m → one sentence naming both.
    const text = run(22, 'buried').customerText;
    expect(text).toContain('buried under the drive and it is longer than 15 m');
    expect(text.match(/quote may be higher/g)).toHaveLength(1);
  });
});
