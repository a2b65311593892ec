// Published cable data for the cable-run check, laid out like the BS 7671 Appendix 4 tables.

export interface CableSize {
  csaMm2: number;
  /** Voltage drop, mV per amp per metre, single-phase AC. */
  mvPerAPerM: number;
  /** Current-carrying capacity, reference method C (clipped direct), amps. */
  capacityAmps: number;
}

/**
 * 2-core armoured copper cable, 90 °C thermosetting insulation, single-phase AC.
 * Voltage drop: BS 7671:2018+A2:2022 Table 4E4B (25 mm² is z; r 1.85, x 0.160).
 * Capacity: Table 4E4A, reference method C (clipped direct), 2-core.
 */
export const TABLE_4E4: readonly CableSize[] = Object.freeze([
  { csaMm2: 2.5, mvPerAPerM: 19, capacityAmps: 36 },
  { csaMm2: 4, mvPerAPerM: 12, capacityAmps: 49 },
  { csaMm2: 6, mvPerAPerM: 7.9, capacityAmps: 62 },
  { csaMm2: 10, mvPerAPerM: 4.7, capacityAmps: 85 },
  { csaMm2: 16, mvPerAPerM: 2.9, capacityAmps: 110 },
  { csaMm2: 25, mvPerAPerM: 1.9, capacityAmps: 146 },
]);

/**
 * The same cable with 70 °C thermoplastic insulation (Table 4D4B), single-phase AC, mV/A/m.
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
