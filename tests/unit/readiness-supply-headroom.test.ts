import { describe, expect, it } from 'vitest';
import { checkSupplyHeadroom } from '../../src/lib/readiness/checks/supply-headroom';
import {
  assessMaximumDemand,
  cookerAllowanceAmps,
  showerAllowanceAmps,
  type DemandItem,
} from '../../src/lib/readiness/demand';
import { defaultReadinessSettings, resolveReadinessSettings } from '../../src/lib/readiness/settings';
import type { FuseRating, LoadAnswers, ReadinessSettingsInput } from '../../src/lib/readiness';

// All amps at 230 V nominal (ESQCR 2002, SI 2002/2665): I = P / 230.
// Diversity: IET On-Site Guide Appendix A, Table A2 (as in The Electrician's Guide, Table 6.2).
// Charger: BS 7671:2018+A2:2022 Regulation 722.311, full rated current, no diversity.
// Default assumptions (settings; common practice, no published source): baseline 10 A,
// cooker 10 kW, immersion 3 kW, existing EV charger 32 A, margin 10 A.

function headroom(mainFuseAmps: FuseRating | null, loads: LoadAnswers | null, settings: ReadinessSettingsInput = {}) {
  return checkSupplyHeadroom({
    answers: { supply: { mainFuseAmps, loads } },
    uploads: [],
    settings: resolveReadinessSettings(settings),
    today: '2025-03-03',
  });
}

describe('Table A2 rules, one load type at a time (IET On-Site Guide Appendix A, Table A2)', () => {
  it.each([
    // Instantaneous water heaters: 100% largest + 100% second + 25% of the rest.
    // 10.5 kW: 10 500 / 230 = 45.652 A at 100%.
    { showers: [45.652], expected: 45.652 },
    // 45.652 + 41.304 (9.5 kW) = 86.956.
    { showers: [41.304, 45.652], expected: 86.956 },
    // 45.652 + 41.304 + 25% × 36.957 (8.5 kW) = 86.956 + 9.239 = 96.195.
    { showers: [36.957, 45.652, 41.304], expected: 96.195 },
    // A fourth 8.5 kW shower adds another 25% × 36.957 = 9.239: 105.435.
    { showers: [36.957, 36.957, 45.652, 41.304], expected: 105.435 },
    { showers: [], expected: 0 },
  ])('showers $showers → $expected A', ({ showers, expected }) => {
    expect(showerAllowanceAmps(showers)).toBeCloseTo(expected, 2);
  });

  it.each([
    // Cooker 10 kW: 10 000 / 230 = 43.478 A → 10 + 30% × 33.478 = 10 + 10.043 = 20.043 A.
    { cookerAmps: 43.478, socket: false, expected: 20.043 },
    // The same with a socket outlet on the control unit: + 5 A = 25.043 A.
    { cookerAmps: 43.478, socket: true, expected: 25.043 },
    // A small cooker drawing 8 A sits wholly within the first 10 A: 8 A.
    { cookerAmps: 8, socket: false, expected: 8 },
    // Exactly 10 A: 10 + 30% × 0 = 10 A.
    { cookerAmps: 10, socket: false, expected: 10 },
  ])('cooker $cookerAmps A (socket $socket) → $expected A', ({ cookerAmps, socket, expected }) => {
    expect(cookerAllowanceAmps(cookerAmps, socket)).toBeCloseTo(expected, 2);
  });
});

describe('itemised assessed maximum demand', () => {
  const allowance = (items: DemandItem[], load: string) => items.find((item) => item.load === load)?.allowanceAmps;

  it.each([
    // Baseline 10 A (common practice) + charger 32 A (722.311): 42 A with nothing else.
    { name: 'nothing declared', loads: {}, load: 'New charge point', amps: 32, total: 42 },
    // Shower 10.5 kW at 100%: 45.65 A; total 10 + 45.65 + 32 = 87.65 A.
    { name: 'shower', loads: { showerKw: 10.5 }, load: 'Electric shower', amps: 45.65, total: 87.65 },
    // Cooker assumed 10 kW: 20.04 A (above); total 10 + 20.04 + 32 = 62.04 A.
    { name: 'cooker', loads: { cooker: true }, load: 'Electric cooker', amps: 20.04, total: 62.04 },
    // Immersion assumed 3 kW, thermostatic water heater at 100%: 3000 / 230 = 13.04 A; total 55.04 A.
    { name: 'immersion', loads: { immersion: true }, load: 'Immersion heater', amps: 13.04, total: 55.04 },
    // Heat pump 5 kW at 100% (our conservative choice): 5000 / 230 = 21.74 A; total 63.74 A.
    { name: 'heat pump', loads: { heatPumpKw: 5 }, load: 'Heat pump', amps: 21.74, total: 63.74 },
    // Storage heaters 6 kW, thermal storage at 100%: 6000 / 230 = 26.09 A; total 68.09 A.
    { name: 'storage heaters', loads: { storageHeaters: 6 }, load: 'Storage heaters', amps: 26.09, total: 68.09 },
    // Existing EV charger, 32 A at 100% (722.311): total 10 + 32 + 32 = 74 A.
    { name: 'existing charger', loads: { otherEvCharger: true }, load: 'Existing EV charger', amps: 32, total: 74 },
    // Solar PV does not reduce demand (absent at night): 0 A; total stays 42 A.
    { name: 'solar PV', loads: { solarPv: true }, load: 'Solar PV or battery', amps: 0, total: 42 },
    // Baseline itself is the settings allowance.
    { name: 'baseline', loads: {}, load: 'Lighting, sockets and small appliances', amps: 10, total: 42 },
  ])('$name: $load allowed $amps A, total $total A', ({ loads, load, amps, total }) => {
    const demand = assessMaximumDemand(loads, defaultReadinessSettings);
    expect(allowance(demand.items, load)).toBeCloseTo(amps, 2);
    expect(demand.assessedDemandAmps).toBeCloseTo(total, 2);
  });

  it('adds every load type together, each by its own rule', () => {
    // 10 baseline + 45.65217 shower + 20.04348 cooker + 13.04348 immersion + 21.73913 heat pump
    // (5 kW) + 26.08696 storage (6 kW) + 32 existing charger + 0 solar = 168.56522 A existing,
    // shown as 168.57; + 32 new charger = 200.56522 A, shown as 200.57.
    const demand = assessMaximumDemand(
      { showerKw: 10.5, cooker: true, immersion: true, heatPumpKw: 5, storageHeaters: 6, otherEvCharger: true, solarPv: true },
      defaultReadinessSettings,
    );
    expect(demand.existingDemandAmps).toBeCloseTo(168.57, 2);
    expect(demand.assessedDemandAmps).toBeCloseTo(200.57, 2);
    expect(demand.items.map((item) => item.load)).toEqual([
      'Lighting, sockets and small appliances',
      'Electric shower',
      'Electric cooker',
      'Immersion heater',
      'Heat pump',
      'Storage heaters',
      'Existing EV charger',
      'Solar PV or battery',
      'New charge point',
    ]);
    for (const item of demand.items) expect(item.rule.length).toBeGreaterThan(10);
  });

  it('treats zero, negative and blank ratings as no load', () => {
    const demand = assessMaximumDemand({ showerKw: 0, heatPumpKw: -3, storageHeaters: null, cooker: false }, defaultReadinessSettings);
    expect(demand.assessedDemandAmps).toBe(42);
    expect(demand.items).toHaveLength(2);
  });

  it('follows the settings: a 16 A charger and a cooker socket', () => {
    // 10 baseline + 25.043 cooker with socket + 16 charger = 51.04 A.
    const settings = resolveReadinessSettings({ chargerAmps: 16, cookerUnitHasSocket: true });
    expect(assessMaximumDemand({ cooker: true }, settings).assessedDemandAmps).toBeCloseTo(51.04, 2);
  });
});

describe('supply-headroom light', () => {
  it.each([
    // 60 A, 10.5 kW shower: 87.65 A > 60 A → over by 27.65 A → red (the e2e case).
    { fuse: 60, loads: { showerKw: 10.5 }, light: 'red', headroomAmps: -27.65 },
    // 80 A, same: 80 − 87.65 = −7.65 A → red.
    { fuse: 80, loads: { showerKw: 10.5 }, light: 'red', headroomAmps: -7.65 },
    // 100 A, same: 100 − 87.65 = 12.35 A ≥ 10 A margin → green (the e2e "clears" case).
    { fuse: 100, loads: { showerKw: 10.5 }, light: 'green', headroomAmps: 12.35 },
    // Solar PV does not help: still 87.65 A on 100 A → green, same headroom.
    { fuse: 100, loads: { showerKw: 10.5, solarPv: true }, light: 'green', headroomAmps: 12.35 },
    // 100 A, shower + immersion: 87.652 + 13.043 = 100.70 A > 100 A → red.
    { fuse: 100, loads: { showerKw: 10.5, immersion: true }, light: 'red', headroomAmps: -0.7 },
    // 100 A, cooker + immersion: 10 + 20.043 + 13.043 + 32 = 75.09 A → 24.91 A spare → green.
    { fuse: 100, loads: { cooker: true, immersion: true }, light: 'green', headroomAmps: 24.91 },
    // 100 A, 8 kW heat pump + cooker: 10 + 34.783 + 20.043 + 32 = 96.83 A → 3.17 A < 10 → amber.
    { fuse: 100, loads: { heatPumpKw: 8, cooker: true }, light: 'amber', headroomAmps: 3.17 },
    // 80 A, nothing declared: 42 A → 38 A spare → green.
    { fuse: 80, loads: {}, light: 'green', headroomAmps: 38 },
    // 60 A, nothing declared: 42 A → 18 A spare, but 60 A is at least amber (common practice).
    { fuse: 60, loads: {}, light: 'amber', headroomAmps: 18 },
    // 100 A but loads not answered at all: 42 A is a lower bound → amber.
    { fuse: 100, loads: null, light: 'amber', headroomAmps: 58 },
  ] as const)('$fuse A with $loads → $light', ({ fuse, loads, light, headroomAmps }) => {
    const result = headroom(fuse, loads);
    expect(result.light).toBe(light);
    expect(result.figures.headroomAmps as number).toBeCloseTo(headroomAmps, 2);
    expect(result.figures.fuseAmps).toBe(fuse);
  });

  it.each([
    // Baseline 38 A: 38 + 32 = 70 A on 80 A → exactly 10 A spare, not less than the margin → green.
    { baselineAmps: 38, light: 'green' },
    // Baseline 38.01 A: 9.99 A spare < 10 A → amber.
    { baselineAmps: 38.01, light: 'amber' },
    // Baseline 48 A: 80 A demand on 80 A → 0 A spare, not over the fuse → amber.
    { baselineAmps: 48, light: 'amber' },
    // Baseline 48.01 A: 80.01 A > 80 A → red.
    { baselineAmps: 48.01, light: 'red' },
  ] as const)('margin edge: baseline $baselineAmps A on 80 A → $light', ({ baselineAmps, light }) => {
    expect(headroom(80, {}, { baselineAmps }).light).toBe(light);
  });

  it('an unknown fuse is at least amber, and red only beyond the largest domestic cut-out', () => {
    // 42 A with nothing declared: could fit any rating, but unknown → amber.
    const unknown = headroom(null, {});
    expect(unknown.light).toBe('amber');
    expect(unknown.figures.headroomByRating).toEqual({ '60': 18, '80': 38, '100': 58 });
    // 10 + 45.652 shower + 26.087 storage (6 kW) + 32 existing + 32 new = 145.74 A > 100 A → red.
    const over = headroom(null, { showerKw: 10.5, storageHeaters: 6, otherEvCharger: true });
    expect(over.light).toBe('red');
    expect(over.figures.assessedDemandAmps as number).toBeCloseTo(145.74, 2);
  });

  it('says why in words, with the caution about the fuse', () => {
    const red = headroom(60, { showerKw: 10.5 });
    expect(red.customerText).toContain('87.7 A');
    expect(red.customerText).toContain('60 A');
    expect(red.customerText).toMatch(/only your network operator may change the main fuse/);
    expect(red.staffText).toMatch(/over by 27\.65 A/);
    expect(red.source).toContain('Table A2');
    expect(red.source).toContain('722.311');
    expect(red.actions.length).toBeGreaterThan(0);
    const green = headroom(100, { showerKw: 10.5 });
    expect(green.actions).toEqual([]);
  });

  it('gives the real reason for an amber in the customer text', () => {
    // 100 A, loads unanswered: 58 A spare is plenty; amber only because the loads are unknown.
    const unknownLoads = headroom(100, null);
    expect(unknownLoads.customerText).not.toMatch(/only about/);
    expect(unknownLoads.customerText).toMatch(/haven't heard about your big electrical appliances/);
    // 100 A, 8 kW heat pump + cooker: 3.17 A spare < 10 A → "only about 3.2 A to spare".
    expect(headroom(100, { heatPumpKw: 8, cooker: true }).customerText).toMatch(/only about 3\.2 A to spare/);
    // 60 A with 18 A spare: amber for the small fuse.
    expect(headroom(60, {}).customerText).toMatch(/on the small side/);
  });
});
