// Cable run: voltage drop and current-carrying capacity for each candidate size of 2-core
// armoured copper cable, the smallest size that passes both, and a flag for costly routes.
import {
  TABLE_4D4B_FROM_MEMORY,
  TABLE_4E4,
  voltageDropPercent,
  voltageDropVolts,
  type CableSize,
} from '../cable-tables';
import { COMMON_PRACTICE, type ReadinessSettings } from '../settings';
import type { CableRoute, CheckInput, CheckResult, Light } from '../types';
import { formatNumber, positiveOrNull, roundTo } from '../units';

const SOURCE = `BS 7671:2018+A2:2022 Appendix 4: Table 4E4B (voltage drop, 2-core armoured copper, 90 °C thermosetting), Table 4E4A (current-carrying capacity, reference method C), Table 4Ab (5% limit); long or complex routes: ${COMMON_PRACTICE}`;
const TITLE = 'Cable from your fuse box to the charger';
const COSTLY_ROUTES: readonly CableRoute[] = ['through-house', 'buried'];

export interface CableSizeRow {
  csaMm2: number;
  mvPerAPerM: number;
  volts: number;
  percent: number;
  capacityAmps: number;
  passesDrop: boolean;
  passesCapacity: boolean;
  passes: boolean;
}

/**
 * One row per candidate size: volts, percent of nominal, and whether it passes the drop limit
 * (Table 4Ab) and carries the current (Table 4E4A, Iz ≥ Ib).
 *
 * @example cableSizeRows(32, 20, defaultReadinessSettings)[2] // 6 mm²: 5.056 V, 2.198%, passes
 */
export function cableSizeRows(amps: number, metres: number, settings: ReadinessSettings): CableSizeRow[] {
  const limitVolts = (settings.voltageDropLimitPercent / 100) * settings.nominalVoltage;
  return TABLE_4E4.map((size: CableSize) => {
    const volts = voltageDropVolts(size.mvPerAPerM, amps, metres);
    const passesDrop = volts <= limitVolts;
    const passesCapacity = size.capacityAmps >= amps;
    return {
      csaMm2: size.csaMm2,
      mvPerAPerM: size.mvPerAPerM,
      volts: roundTo(volts, 3),
      percent: roundTo(voltageDropPercent(volts, settings.nominalVoltage), 3),
      capacityAmps: size.capacityAmps,
      passesDrop,
      passesCapacity,
      passes: passesDrop && passesCapacity,
    };
  });
}

/**
 * The smallest size passing both voltage drop and capacity, or null when none does.
 *
 * @example recommendedCsaMm2(cableSizeRows(32, 20, defaultReadinessSettings)) // 4
 */
export function recommendedCsaMm2(rows: readonly CableSizeRow[]): number | null {
  return rows.find((row) => row.passes)?.csaMm2 ?? null;
}

/**
 * The same drop figures from the 70 °C Table 4D4B values, which are from memory: comparison only.
 *
 * @example reference70CRows(32, 20, defaultReadinessSettings)[0].volts // 18 × 32 × 20 / 1000 = 11.52
 */
export function reference70CRows(amps: number, metres: number, settings: ReadinessSettings) {
  return TABLE_4D4B_FROM_MEMORY.map((size) => {
    const volts = voltageDropVolts(size.mvPerAPerM, amps, metres);
    return {
      csaMm2: size.csaMm2,
      mvPerAPerM: size.mvPerAPerM,
      volts: roundTo(volts, 3),
      percent: roundTo(voltageDropPercent(volts, settings.nominalVoltage), 3),
    };
  });
}

/**
 * Red when no size passes; amber for an unknown length or route, a costly route or a long run.
 *
 * @example checkCableRun({ answers: { charger: { cableRunMetres: 10, route: 'through-wall' } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).figures.recommendedCsaMm2
 * // 2.5 (19 × 32 × 10 / 1000 = 6.08 V, 2.64%; 36 A ≥ 32 A)
 */
export function checkCableRun({ answers, settings }: CheckInput): CheckResult {
  const charger = answers.charger ?? {};
  const metres = positiveOrNull(charger.cableRunMetres);
  const route = charger.route ?? null;
  const amps = settings.chargerAmps;
  if (metres === null) return unknownLengthResult(route, settings);
  const rows = cableSizeRows(amps, metres, settings);
  const recommended = recommendedCsaMm2(rows);
  const light = cableRunLight(recommended, metres, route, settings);
  return {
    id: 'cable-run',
    light,
    title: TITLE,
    customerText: customerText(light, recommended, metres, route, settings),
    staffText: staffText(rows, recommended, metres, route, settings),
    figures: {
      currentAmps: amps,
      lengthMetres: metres,
      route,
      limitPercent: settings.voltageDropLimitPercent,
      limitVolts: roundTo((settings.voltageDropLimitPercent / 100) * settings.nominalVoltage, 3),
      table: 'BS 7671 Table 4E4B (voltage drop) and Table 4E4A method C (capacity): 2-core armoured copper, 90 °C thermosetting',
      sizes: rows,
      recommendedCsaMm2: recommended,
      longRunThresholdMetres: settings.longRunMetres,
      reference70C: {
        table: 'BS 7671 Table 4D4B, 70 °C thermoplastic — from memory, not seen in the source; not used to recommend',
        fromMemory: true,
        sizes: reference70CRows(amps, metres, settings),
      },
    },
    source: SOURCE,
    actions: actions(light, recommended, metres, route, settings),
  };
}

/**
 * The light for a computed run.
 *
 * @example cableRunLight(6, 25, 'along-wall', defaultReadinessSettings) // 'amber' (longer than 15 m)
 */
export function cableRunLight(
  recommended: number | null,
  metres: number,
  route: CableRoute | null,
  settings: ReadinessSettings,
): Light {
  if (recommended === null) return 'red';
  if (route === null || COSTLY_ROUTES.includes(route) || metres > settings.longRunMetres) return 'amber';
  return 'green';
}

function routeWords(route: CableRoute | null): string {
  const words: Record<CableRoute, string> = {
    'through-wall': 'straight through the wall',
    'along-wall': 'along the outside wall',
    'through-house': 'through the house',
    buried: 'buried under the drive',
  };
  return route ? words[route] : 'by a route not chosen yet';
}

function customerText(
  light: Light,
  recommended: number | null,
  metres: number,
  route: CableRoute | null,
  settings: ReadinessSettings,
): string {
  if (recommended === null) {
    return `A cable run of about ${formatNumber(metres)} m is longer than any of the usual cable sizes can manage without losing too much voltage. The surveyor will look at another spot for the charger or another way to feed it.`;
  }
  const base = `A cable run of about ${formatNumber(metres)} m ${routeWords(route)} looks workable.`;
  if (light === 'green') return base;
  const costly = route !== null && COSTLY_ROUTES.includes(route);
  const long = metres > settings.longRunMetres;
  const extra: string[] = [];
  if (costly || long) {
    const why = [costly ? `it goes ${routeWords(route)}` : '', long ? `it is longer than ${settings.longRunMetres} m` : '']
      .filter(Boolean)
      .join(' and ');
    extra.push(`Because ${why}, it takes more cable and work, so the quote may be higher.`);
  }
  if (route === null) extra.push('Please tell us how the cable could get from your fuse box to the charger.');
  return `${base} ${extra.join(' ')}`;
}

function staffText(
  rows: readonly CableSizeRow[],
  recommended: number | null,
  metres: number,
  route: CableRoute | null,
  settings: ReadinessSettings,
): string {
  const table = rows
    .map((r) => `${r.csaMm2} mm² ${r.volts} V (${r.percent}%)${r.passesCapacity ? '' : ` Iz ${r.capacityAmps} A < Ib`}`)
    .join('; ');
  const verdict =
    recommended === null
      ? 'No candidate size passes: consider a sub-main, relocation or a lower charger current.'
      : `Smallest passing: ${recommended} mm².`;
  return `Final-circuit voltage drop at ${settings.chargerAmps} A over ${formatNumber(metres)} m, 2-core SWA, 4E4B (90 °C): ${table}. Limit ${settings.voltageDropLimitPercent}% (Table 4Ab) for the whole installation — upstream drop not included. ${verdict} Capacity from 4E4A method C without correction factors (grouping, ambient, insulation; buried runs use method D). Route: ${route ?? 'not given'}.`;
}

function actions(
  light: Light,
  recommended: number | null,
  metres: number,
  route: CableRoute | null,
  settings: ReadinessSettings,
): string[] {
  if (light === 'green') return [];
  const list: string[] = [];
  if (recommended === null) list.push('The surveyor to consider a charger position closer to the consumer unit, or another supply arrangement.');
  if (route === null) list.push('Choose how the cable could run from the consumer unit to the charger.');
  if ((route !== null && COSTLY_ROUTES.includes(route)) || metres > settings.longRunMetres) {
    list.push('The office to price the longer or more complex route at survey.');
  }
  return list;
}

function unknownLengthResult(route: CableRoute | null, settings: ReadinessSettings): CheckResult {
  return {
    id: 'cable-run',
    light: 'amber',
    title: TITLE,
    customerText: 'Please give a rough estimate of the cable length from your fuse box (consumer unit) to where you would like the charger — pacing it out is fine.',
    staffText: `Cable run length not given; voltage drop not computed (${settings.chargerAmps} A, 4E4B). Route: ${route ?? 'not given'}.`,
    figures: {
      currentAmps: settings.chargerAmps,
      lengthMetres: null,
      route,
      limitPercent: settings.voltageDropLimitPercent,
      limitVolts: roundTo((settings.voltageDropLimitPercent / 100) * settings.nominalVoltage, 3),
      sizes: [],
      recommendedCsaMm2: null,
      longRunThresholdMetres: settings.longRunMetres,
    },
    source: SOURCE,
    actions: ['Estimate the cable length from the consumer unit to the charge point.'],
  };
}
