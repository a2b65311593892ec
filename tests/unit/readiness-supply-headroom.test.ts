import { describe, expect, it } from 'vitest';
import { checkSupplyHeadroom } from '@/lib/readiness/checks/supply-headroom';
import {
  assessMaximumDemand,
  cookerAllowanceAmps,
  lightingAllowanceAmps,
  showerAllowanceAmps,
  socketAllowanceAmps,
  type DemandItem,
} from '@/lib/readiness/demand';
import { defaultReadinessSettings, resolveReadinessSettings } from '@/lib/readiness/settings';
import type { ChecklistAnswers, FuseRating, LoadAnswers, ReadinessSettingsInput, SiteMeasures, SupplyPhases } from '@/lib/readiness';

// All amps at 230 V nominal (ESQCR 2002, SI 2002/2665): I = P / 230.
// Diversity: IET On-Site Guide Appendix A, Table A2 (as in The Electrician's Guide, Table 6.2).
// Charger: BS 7671:2018+A2:2022 Regulation 722.311, full rated current, no diversity.
// Table A2 is known here second-hand (The Electrician's Guide, EPA Press, Table 6.2); the OSG's
// own wording was not seen.
// Default assumptions (settings; common practice, no published source): each socket circuit a
// 32 A ring, 2 circuits when the customer is not sure, 2 kW of lighting, cooker 10 kW,
// immersion 3 kW, existing EV charger 32 A, margin 10 A.
//
// Two figures recur below, worked by hand:
//   sockets, 2 circuits of 32 A: 100% of the largest + 40% of the other = 32 + 12.8 = 44.8 A
//   lighting: 66% × 2000 W / 230 V = 0.66 × 8.696 = 5.739 A
//   so a home with nothing else declared and a 32 A charger: 44.8 + 5.739 + 32 = 82.539 A.

/** Every load question answered "none", then the given answers over the top. */
const none: LoadAnswers = { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 2 };

function headroom(
  mainFuseAmps: FuseRating | null,
  loads: LoadAnswers | null,
  settings: ReadinessSettingsInput = {},
  extra: { ratingKw?: number | null; phases?: SupplyPhases; site?: SiteMeasures } = {},
) {
  const answers: ChecklistAnswers = {
    supply: { mainFuseAmps, loads, ...(extra.phases ? { phases: extra.phases } : {}) },
    charger: { ratingKw: extra.ratingKw === undefined ? 7.4 : extra.ratingKw },
  };
  return checkSupplyHeadroom({ answers, uploads: [], site: extra.site ?? {}, settings: resolveReadinessSettings(settings), today: '2025-03-03' });
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

  it.each([
    // Socket outlets: 100% of the largest circuit + 40% of every other, 32 A each.
    { circuits: 1, expected: 32 },
    { circuits: 2, expected: 44.8 }, // 32 + 0.4 × 32
    { circuits: 3, expected: 57.6 }, // 32 + 0.4 × 64
    { circuits: 5, expected: 83.2 }, // 32 + 0.4 × 128
  ])('$circuits socket circuits → $expected A', ({ circuits, expected }) => {
    expect(socketAllowanceAmps(circuits, 32)).toBeCloseTo(expected, 3);
  });

  it('lighting: 66% of 2 kW at 230 V = 5.739 A; of 1 kW = 2.870 A', () => {
    expect(lightingAllowanceAmps(2, 230)).toBeCloseTo(5.739, 3);
    expect(lightingAllowanceAmps(1, 230)).toBeCloseTo(2.87, 3);
  });
});

describe('itemised assessed maximum demand', () => {
  const assess = (loads: LoadAnswers, extra: { ratingKw?: number; phases?: SupplyPhases; site?: SiteMeasures } = {}, settings: ReadinessSettingsInput = {}) =>
    assessMaximumDemand(
      { supply: { loads, ...(extra.phases ? { phases: extra.phases } : {}) }, charger: { ratingKw: extra.ratingKw ?? 7.4 } },
      extra.site ?? {},
      resolveReadinessSettings(settings),
    );
  const allowance = (items: DemandItem[], load: string) => items.find((item) => item.load === load)?.allowanceAmps;

  it.each([
    // Each adds its Table A2 allowance to the 82.539 A of sockets, lighting and charger.
    { name: 'shower 10.5 kW', loads: { showerKw: 10.5 }, load: 'Electric shower', amps: 45.65, total: 128.19 }, // 10 500 / 230 = 45.652
    { name: 'cooker', loads: { cooker: true }, load: 'Electric cooker', amps: 20.04, total: 102.58 }, // 10 + 0.3 × 33.478
    { name: 'immersion 3 kW', loads: { immersion: true }, load: 'Immersion heater', amps: 13.04, total: 95.58 }, // 3000 / 230, 100%
    { name: 'heat pump 5 kW', loads: { heatPumpKw: 5 }, load: 'Heat pump', amps: 21.74, total: 104.28 }, // 5000 / 230, 100%
    { name: 'storage 6 kW', loads: { storageHeaters: 6 }, load: 'Storage heaters', amps: 26.09, total: 108.63 }, // 6000 / 230, 100%
    { name: 'existing charger', loads: { otherEvCharger: true }, load: 'Existing EV charger', amps: 32, total: 114.54 }, // 722.311
    { name: 'solar', loads: { solarPv: true }, load: 'Solar PV or battery', amps: 0, total: 82.54 },
    { name: 'three socket circuits', loads: { socketCircuits: 3 }, load: 'Socket-outlet circuits', amps: 57.6, total: 95.34 }, // 57.6 + 5.739 + 32
  ])('$name: $load allowed $amps A, total $total A', ({ loads, load, amps, total }) => {
    const demand = assess({ ...none, ...loads });
    expect(allowance(demand.items, load)).toBeCloseTo(amps, 2);
    expect(demand.assessedDemandAmps).toBeCloseTo(total, 2);
    expect(demand.firm).toBe(true);
  });

  it('names each rule it applied', () => {
    const demand = assess({ ...none, showerKw: 9.5, cooker: true });
    const rules = demand.items.map((item) => item.rule).join(' | ');
    expect(rules).toMatch(/100% of the largest \+ 40% of every other/);
    expect(rules).toMatch(/Lighting: 66%/);
    expect(rules).toMatch(/10 A \+ 30% of the balance/);
    expect(rules).toMatch(/Instantaneous water heater/);
    expect(rules).toMatch(/722\.311/);
  });

  it('a measured maximum demand replaces the estimate of the existing loads', () => {
    // 41 A measured + 32 A charger at full load = 73 A, whatever the estimate would say.
    const demand = assess({ ...none, showerKw: 10.5 }, { site: { measuredMaxDemandAmps: 41 } });
    expect(demand.basis).toBe('measured');
    expect(demand.assessedDemandAmps).toBe(73);
    expect(demand.items.map((i) => i.load)).toEqual(['Existing maximum demand, measured', 'New charge point']);
    expect(demand.firm).toBe(true);
  });

  it('per phase on a three-phase supply, largest load first on the least-loaded phase', () => {
    // Shower 45.652 → L1; sockets 44.8 → L2; lighting 5.739 → L3. A 22 kW charger adds 32 A to
    // each: 77.652 / 76.8 / 37.739 A; the busiest phase is 77.65 A.
    const demand = assess({ ...none, showerKw: 10.5 }, { ratingKw: 22, phases: 'three' });
    expect(demand.phaseDemandAmps).toEqual([77.65, 76.8, 37.74]);
    expect(demand.assessedDemandAmps).toBe(77.65);
    // A 7.4 kW single-phase charger goes on the busiest phase only: 45.652 + 32 = 77.652.
    expect(assess({ ...none, showerKw: 10.5 }, { ratingKw: 7.4, phases: 'three' }).phaseDemandAmps).toEqual([77.65, 44.8, 5.74]);
  });

  it('an 11 kW charger is 16 A a phase, a 3.6 kW one 16 A on one phase (common practice)', () => {
    expect(assess(none, { ratingKw: 11, phases: 'three' }).chargerAmps).toBe(16);
    expect(assess(none, { ratingKw: 3.6 }).assessedDemandAmps).toBeCloseTo(66.54, 2); // 44.8 + 5.739 + 16
  });

  it('follows the settings: a cooker socket adds 5 A', () => {
    const demand = assess({ ...none, cooker: true }, {}, { cookerUnitHasSocket: true });
    expect(allowance(demand.items, 'Electric cooker')).toBeCloseTo(25.04, 2);
  });
});

describe('loads count as declared only when every load question has an answer', () => {
  it.each([
    { name: 'nothing saved', loads: null },
    { name: 'one field saved', loads: { cooker: false } },
    { name: 'every field but the shower', loads: { ...none, showerKw: undefined } },
    { name: 'every field but the socket circuits', loads: { ...none, socketCircuits: null } },
  ])('$name → not declared, never green', ({ loads }) => {
    const result = headroom(100, loads as LoadAnswers | null);
    expect(result.figures.loadsDeclared).toBe(false);
    expect(result.light).not.toBe('green');
  });

  it('"not sure" about socket circuits is an answer, but the estimate is then not firm: amber', () => {
    const result = headroom(100, { ...none, socketCircuits: 'unsure' });
    expect(result.figures.loadsDeclared).toBe(true);
    expect(result.figures.firm).toBe(false);
    expect(result.light).toBe('amber');
  });
});

describe('supply-headroom light', () => {
  it.each([
    // 82.539 A on 100 A: 17.46 A spare ≥ 10 A margin → green.
    { fuse: 100, loads: none, light: 'green' },
    // On 80 A: over by 2.54 A, every answer in → red.
    { fuse: 80, loads: none, light: 'red' },
    // A 10.5 kW shower: 128.19 A, over 100 A → red. (Table A2 as published: a measured demand can show otherwise.)
    { fuse: 100, loads: { ...none, showerKw: 10.5 }, light: 'red' },
    { fuse: 60, loads: { ...none, showerKw: 10.5 }, light: 'red' },
    // Only the shower saved on 100 A: even the least (1 socket circuit 32 + 5.739 + 45.652 + 32 = 115.39 A) is over → red.
    { fuse: 100, loads: { showerKw: 10.5 }, light: 'red' },
    // Only the cooker "no" saved on 100 A: the least is 32 + 5.739 + 32 = 69.74 A, the estimate 82.54 A → amber, not green.
    { fuse: 100, loads: { cooker: false }, light: 'amber' },
    // 3.6 kW on 100 A: 44.8 + 5.739 + 16 = 66.54 A, 33.46 A spare → green.
    { fuse: 100, loads: none, ratingKw: 3.6, light: 'green' },
    // 60 A with a 3.6 kW charger: 66.54 A > 60 A → red.
    { fuse: 60, loads: none, ratingKw: 3.6, light: 'red' },
  ] as const)('$fuse A with $loads, $ratingKw kW → $light', ({ fuse, loads, light, ...rest }) => {
    expect(headroom(fuse, loads as LoadAnswers, {}, 'ratingKw' in rest ? { ratingKw: rest.ratingKw } : {}).light).toBe(light);
  });

  it('a measured maximum demand can clear what Table A2 calls over: 41 + 32 = 73 A on 100 A → green', () => {
    const result = headroom(100, { ...none, showerKw: 10.5 }, {}, { site: { measuredMaxDemandAmps: 41 } });
    expect(result.light).toBe('green');
    expect(result.figures.basis).toBe('measured');
    expect(result.staffText).toMatch(/measured/);
    // 41 + 32 = 73 A on 80 A: 7 A spare < 10 A margin → amber.
    expect(headroom(80, none, {}, { site: { measuredMaxDemandAmps: 41 } }).light).toBe('amber');
  });

  it('margin edge on 100 A with a measured demand: 58 + 32 = 90 A (10 A spare) green; 58.01 A amber', () => {
    expect(headroom(100, null, {}, { site: { measuredMaxDemandAmps: 58 } }).light).toBe('green');
    expect(headroom(100, null, {}, { site: { measuredMaxDemandAmps: 58.01 } }).light).toBe('amber');
  });

  it('an unknown fuse is amber, and red only when even the least demand is beyond 100 A', () => {
    expect(headroom(null, none).light).toBe('amber');
    // 32 + 5.739 + 45.652 + 32 = 115.39 A > 100 A with one socket circuit → red whatever the fuse.
    expect(headroom(null, { showerKw: 10.5 }).light).toBe('red');
  });

  it('11 or 22 kW needs three phases: red on a single-phase supply, amber while not known', () => {
    expect(headroom(100, none, {}, { ratingKw: 22, phases: 'single' }).light).toBe('red');
    expect(headroom(100, none, {}, { ratingKw: 22, phases: 'unsure' }).light).toBe('amber');
    // Three phase: 44.8 → L1, 5.739 → L2; + 32 each = 76.8 / 37.74 / 32 A on 100 A per phase → green.
    const three = headroom(100, none, {}, { ratingKw: 22, phases: 'three' });
    expect(three.light).toBe('green');
    expect(three.figures.phaseDemandAmps).toEqual([76.8, 37.74, 32]);
  });

  it('an assumed charger rating is stated in the working', () => {
    const result = headroom(100, none, {}, { ratingKw: null });
    expect(result.figures.chargerChosen).toBe(false);
    expect((result.figures.assumptions as string[]).join(' ')).toMatch(/not chosen/);
  });

  it('says why in plain words, with the caution about the fuse', () => {
    const red = headroom(60, { ...none, showerKw: 10.5 });
    expect(red.customerText).toMatch(/more than your 60 A main fuse/);
    expect(red.customerText).toMatch(/only your network operator may change the main fuse/);
    expect(red.customerText).not.toMatch(/Table A2|diversity|722/);
    const partial = headroom(100, { cooker: false });
    expect(partial.customerText).toMatch(/haven't heard about all of your big electrical appliances/);
  });
});

describe('an assumed charger rating', () => {
  it('32 A assumed is the most a single-phase charge point draws, so the figure stays firm; 16 A assumed does not', () => {
    // 44.8 + 5.739 + 32 = 82.54 A on 100 A → green even before a rating is chosen.
    expect(headroom(100, none, {}, { ratingKw: null }).light).toBe('green');
    // With 16 A assumed in settings: 66.54 A, but the customer may yet choose 7.4 kW → amber.
    expect(headroom(100, none, { chargerAmps: 16 }, { ratingKw: null }).light).toBe('amber');
  });
});
