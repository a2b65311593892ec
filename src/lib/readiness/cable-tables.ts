// Published cable data for the cable-run check, laid out like the BS 7671 Appendix 4 tables.
// Every row says where it comes from; values not seen in the source are marked "from memory".
// The cable is multicore armoured copper (SWA) throughout; the insulation is 90 °C
// thermosetting (XLPE), the usual cable, sized on the 70 °C ratings unless the terminals are
// declared for 90 °C (Regulation 512.1.5 and the notes to the 90 °C tables).

export type ReferenceMethod = 'C' | 'D';
export type TerminalTemperature = 70 | 90;
export type Phases = 1 | 3;

export interface CableSize {
  csaMm2: number;
  /**
   * Voltage drop, mV per amp per metre, Table 4E4B (90 °C). Single phase: 2-core, column 3;
   * three phase: 3- or 4-core, column 4 (line-to-line). Used for every basis, since a 90 °C
   * cable run cooler than 90 °C drops less: conservative.
   */
  mvPerAPerM: Record<Phases, number>;
  /** Current-carrying capacity, amps, by terminal basis, reference method and phases. */
  capacityAmps: Record<TerminalTemperature, Record<ReferenceMethod, Record<Phases, number>>>;
}

/**
 * Where each column comes from, for the figures and the pack. Staff read "confirm against the
 * printed table" where a column is from memory, not seen in the source: the 3- or 4-core drop
 * (4E4B), every 70 °C rating (4D4A), and the 3- or 4-core 90 °C ratings (4E4A).
 */
export const cableTableSources = Object.freeze({
  drop: {
    1: 'BS 7671 Table 4E4B, 2-core, single-phase a.c. (90 °C thermosetting armoured); 25 mm²: r 1.85, x 0.160, z = √(r² + x²) ≈ 1.86 (printed z not seen)',
    3: 'BS 7671 Table 4E4B, 3- or 4-core, three-phase a.c. (90 °C) — confirm against the printed table',
  },
  capacity: {
    70: {
      C: 'BS 7671 Table 4D4A (70 °C thermoplastic armoured), reference method C (clipped direct) — confirm against the printed table',
      D: 'BS 7671 Table 4D4A (70 °C thermoplastic armoured), reference method D (in the ground or in ducts in the ground) — confirm against the printed table',
    },
    90: {
      C: 'BS 7671 Table 4E4A (90 °C thermosetting armoured), reference method C (clipped direct); 3- or 4-core: confirm against the printed table',
      D: 'No 90 °C method D rating used: a buried run is sized on the 70 °C method D ratings (Table 4D4A), which are lower, so the choice errs safe',
    },
  },
});

/**
 * The candidate sizes, 2.5 to 25 mm².
 *
 * Drop, single phase (4E4B col. 3): 19, 12, 7.9, 4.7, 2.9, and 1.86 for 25 mm² (the earlier
 * 1.9 disagreed with r 1.85 and x 0.160: √(1.85² + 0.160²) = √3.4481 = 1.857).
 * Drop, three phase (4E4B col. 4, from memory): 16, 10, 6.8, 4.0, 2.5, 1.65.
 * 90 °C method C (4E4A): 2-core 36, 49, 62, 85, 110, 146 (source); 3/4-core 31, 41, 53, 72, 94, 124 (from memory).
 * 70 °C method C (4D4A, from memory): 2-core 28, 38, 49, 67, 89, 118; 3/4-core 25, 33, 42, 58, 77, 102.
 * 70 °C method D (4D4A, from memory): 2-core 29, 37, 46, 60, 78, 99; 3/4-core 24, 30, 38, 50, 64, 82.
 */
export const CABLE_SIZES: readonly CableSize[] = Object.freeze(
  [
    row(2.5, [19, 16], [28, 25], [29, 24], [36, 31]),
    row(4, [12, 10], [38, 33], [37, 30], [49, 41]),
    row(6, [7.9, 6.8], [49, 42], [46, 38], [62, 53]),
    row(10, [4.7, 4.0], [67, 58], [60, 50], [85, 72]),
    row(16, [2.9, 2.5], [89, 77], [78, 64], [110, 94]),
    row(25, [1.86, 1.65], [118, 102], [99, 82], [146, 124]),
  ].map((size) => Object.freeze(size)),
);

type Pair = [single: number, three: number];

// The 90 °C method D column repeats 70 °C method D: see cableTableSources.capacity[90].D.
function row(csaMm2: number, drop: Pair, c70: Pair, d70: Pair, c90: Pair): CableSize {
  const byPhase = ([single, three]: Pair) => ({ 1: single, 3: three });
  return {
    csaMm2,
    mvPerAPerM: byPhase(drop),
    capacityAmps: {
      70: { C: byPhase(c70), D: byPhase(d70) },
      90: { C: byPhase(c90), D: byPhase(d70) },
    },
  };
}

/** r and x of the 25 mm² 2-core row (Table 4E4B), kept so the z above can be checked. */
export const TABLE_4E4B_25MM2 = Object.freeze({ r: 1.85, x: 0.16 });

/**
 * The same 2-core cable with 70 °C thermoplastic insulation (Table 4D4B), single-phase AC, mV/A/m.
 * From memory, not seen in the source: shown for comparison only, never used to recommend.
 */
export const TABLE_4D4B_FROM_MEMORY: readonly { csaMm2: number; mvPerAPerM: number }[] = Object.freeze([
  { csaMm2: 2.5, mvPerAPerM: 18 },
  { csaMm2: 4, mvPerAPerM: 11 },
  { csaMm2: 6, mvPerAPerM: 7.3 },
  { csaMm2: 10, mvPerAPerM: 4.4 },
  { csaMm2: 16, mvPerAPerM: 2.8 },
]);

/**
 * Voltage drop V = (mV/A/m) × I × L / 1000 (BS 7671 Appendix 4).
 *
 * @example voltageDropVolts(7.9, 32, 20) // 5.056
 */
export function voltageDropVolts(mvPerAPerM: number, amps: number, metres: number): number {
  return (mvPerAPerM * amps * metres) / 1000;
}

/**
 * Voltage drop as a percentage of the nominal voltage.
 *
 * @example voltageDropPercent(5.056, 230) // 2.198…
 */
export function voltageDropPercent(volts: number, nominalVoltage: number): number {
  return (volts / nominalVoltage) * 100;
}
