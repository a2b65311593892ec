// Cable run: for each candidate size of armoured copper cable, the corrected capacity against
// the protective device (Ib ≤ In ≤ Iz, Regulation 433.1.1) and the voltage drop against what is
// left of the limit; the smallest size that passes both; and a flag for costly routes.
import { optionWords } from '@/lib/vocabulary/fields';
import {
  CABLE_SIZES,
  cableTableSources,
  TABLE_4D4B_FROM_MEMORY,
  voltageDropPercent,
  voltageDropVolts,
  type Phases,
  type ReferenceMethod,
} from '@/lib/readiness/cable-tables';
import { chargerRating, type ChargerRating } from '@/lib/readiness/charger';
import { atLeast } from '@/lib/readiness/lights';
import { COMMON_PRACTICE, type ReadinessSettings } from '@/lib/readiness/settings';
import type { CableRoute, CheckInput, CheckResult, Light } from '@/lib/readiness/types';
import { formatNumber, positiveOrNull, roundTo } from '@/lib/readiness/units';
import { checkTitles } from '../check-titles';

const SOURCE = `BS 7671:2018+A2:2022: Regulation 433.1.1 (Ib ≤ In ≤ Iz), 512.1.5 (terminal temperature), 523.9 (thermal insulation); Appendix 4 Tables 4D4A / 4E4A (capacity), 4E4B (voltage drop), 4B1–4B3 and 4C1 (correction factors), Table 4Ab (5% limit); long or complex routes: ${COMMON_PRACTICE}`;
const TITLE = checkTitles['cable-run'];
const COSTLY_ROUTES: readonly CableRoute[] = ['through-house', 'buried'];

/** One correction factor applied to the tabulated capacity, with its source. */
export interface CorrectionFactor {
  name: string;
  value: number;
  basis: string;
}

/** How the capacity was worked: method, table and factors for the chosen route. */
export interface CapacityBasis {
  terminalTemperatureC: 70 | 90;
  method: ReferenceMethod;
  phases: Phases;
  table: string;
  factors: CorrectionFactor[];
  /** Product of the factors. */
  factor: number;
  routeAssumption: string | null;
}

export interface CableSizeRow {
  csaMm2: number;
  mvPerAPerM: number;
  volts: number;
  percent: number;
  /** Tabulated capacity It before correction. */
  tabulatedAmps: number;
  /** Corrected capacity Iz = It × factors. */
  capacityAmps: number;
  passesDrop: boolean;
  /** Iz ≥ In. */
  passesCapacity: boolean;
  passes: boolean;
}

export interface CableDesign {
  charger: ChargerRating;
  deviceAmps: number;
  basis: CapacityBasis;
  limitPercent: number;
  upstreamPercent: number;
  /** Volts left for this circuit: (limit − upstream) % of the nominal (line voltage on three phases). */
  allowedVolts: number;
  referenceVolts: number;
}

const AIR_AMBIENT: CorrectionFactor = { name: 'Ambient air 30 °C (Ca)', value: 1, basis: 'Table 4B1 at the tabulated 30 °C — assumed' };
const NOT_GROUPED: CorrectionFactor = { name: 'Single circuit, not grouped (Cg)', value: 1, basis: 'Table 4C1, one circuit — assumed' };
const GROUND_AMBIENT: CorrectionFactor = { name: 'Ground 20 °C (Ca)', value: 1, basis: 'Table 4B2 at the tabulated 20 °C — assumed' };
const SOIL: CorrectionFactor = { name: 'Soil thermal resistivity 2.5 K·m/W', value: 1, basis: 'Table 4B3 at the tabulated value — assumed; confirm against the printed table' }; // from memory
const INSULATION: CorrectionFactor = {
  name: 'Surrounded by thermal insulation over 0.5 m (Ci)',
  value: 0.5,
  basis: 'Regulation 523.9: half the clipped-direct rating',
};

/**
 * The reference method and correction factors for a route. A buried run is method D; a run
 * through the house may cross loft or floor insulation, so it is halved (523.9) until the
 * surveyor says otherwise; an unknown route is sized for the worst of these.
 *
 * @example capacityBasis('buried', 70, 1).method // 'D'
 */
export function capacityBasis(route: CableRoute | null, terminalTemperatureC: 70 | 90, phases: Phases): CapacityBasis {
  const method: ReferenceMethod = route === 'buried' ? 'D' : 'C';
  const table = `${cableTableSources.capacity[terminalTemperatureC][method]}; ${phases === 1 ? '2-core' : '3- or 4-core'} column`;
  if (route === 'buried') return { terminalTemperatureC, method, phases, table, factors: [GROUND_AMBIENT, SOIL, NOT_GROUPED], factor: 1, routeAssumption: 'Direct in the ground or in a duct at about 0.7 m — assumed' };
  if (route === 'through-house' || route === null) {
    const why =
      route === null
        ? 'Route not chosen: sized for the worst listed route (through thermal insulation)'
        : 'Through the house: may cross loft or floor insulation — assumed until surveyed';
    return { terminalTemperatureC, method, phases, table, factors: [AIR_AMBIENT, NOT_GROUPED, INSULATION], factor: 0.5, routeAssumption: why };
  }
  return { terminalTemperatureC, method, phases, table, factors: [AIR_AMBIENT, NOT_GROUPED], factor: 1, routeAssumption: null };
}

/**
 * The design the rows are worked against: charger current Ib, device rating In, capacity
 * basis, and the volts left for this circuit.
 *
 * @example cableDesign({ charger: { route: 'along-wall' } }, defaultReadinessSettings).allowedVolts // 11.5 (5% of 230 V)
 */
export function cableDesign(answers: CheckInput['answers'], settings: ReadinessSettings): CableDesign {
  const charger = chargerRating(answers, settings);
  // The circuit follows the charge point: a three-phase unit needs a three-phase circuit.
  const phases: Phases = charger.phases;
  const basis = capacityBasis(answers.charger?.route ?? null, settings.terminalTemperatureC, phases);
  const referenceVolts = phases === 3 ? settings.nominalVoltage * Math.sqrt(3) : settings.nominalVoltage;
  const leftPercent = Math.max(settings.voltageDropLimitPercent - settings.upstreamDropPercent, 0);
  return {
    charger,
    deviceAmps: settings.protectiveDeviceAmps,
    basis,
    limitPercent: settings.voltageDropLimitPercent,
    upstreamPercent: settings.upstreamDropPercent,
    allowedVolts: roundTo((leftPercent / 100) * referenceVolts, 3),
    referenceVolts: roundTo(referenceVolts, 1),
  };
}

/**
 * One row per candidate size: tabulated and corrected capacity against In, and the drop at Ib
 * against the volts left.
 *
 * @example cableSizeRows(design, 20)[0] // 2.5 mm² on 70 °C method C: It 28 A < In 32 A, fails
 */
export function cableSizeRows(design: CableDesign, metres: number): CableSizeRow[] {
  const { basis, charger, deviceAmps } = design;
  return CABLE_SIZES.map((size) => {
    const mv = size.mvPerAPerM[basis.phases];
    const volts = voltageDropVolts(mv, charger.ampsPerPhase, metres);
    const tabulatedAmps = size.capacityAmps[basis.terminalTemperatureC][basis.method][basis.phases];
    const capacityAmps = roundTo(tabulatedAmps * basis.factor, 2);
    const passesDrop = volts <= design.allowedVolts;
    const passesCapacity = capacityAmps >= deviceAmps && deviceAmps >= charger.ampsPerPhase;
    return {
      csaMm2: size.csaMm2,
      mvPerAPerM: mv,
      volts: roundTo(volts, 3),
      percent: roundTo(voltageDropPercent(volts, design.referenceVolts), 3),
      tabulatedAmps,
      capacityAmps,
      passesDrop,
      passesCapacity,
      passes: passesDrop && passesCapacity,
    };
  });
}

/**
 * The smallest size passing both voltage drop and capacity, or null when none does.
 *
 * @example recommendedCsaMm2(cableSizeRows(design32AAlongWall, 20)) // 6 (4 mm²: 12 × 32 × 20 / 1000 = 7.68 V fits, but see the tests)
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
 * Red when no size passes; amber for an unknown length or route, a costly route, a long run or
 * an assumed charger rating.
 *
 * @example checkCableRun({ answers: { charger: { cableRunMetres: 10, route: 'along-wall', ratingKw: 7.4 } }, uploads: [], site: {}, settings: defaultReadinessSettings, today: '2025-01-01' }).figures.recommendedCsaMm2
 * // 4 (2.5 mm²: 28 A < 32 A; 4 mm²: 38 A ≥ 32 A and 12 × 32 × 10 / 1000 = 3.84 V ≤ 11.5 V)
 */
export function checkCableRun({ answers, settings }: CheckInput): CheckResult {
  const charger = answers.charger ?? {};
  const metres = positiveOrNull(charger.cableRunMetres);
  const route = charger.route ?? null;
  const design = cableDesign(answers, settings);
  if (metres === null) return unknownLengthResult(route, design);
  const rows = cableSizeRows(design, metres);
  const recommended = recommendedCsaMm2(rows);
  // The current the sizes rest on is only assumed until the customer picks a rating.
  const computed = cableRunLight(recommended, metres, route, settings);
  const light = design.charger.chosen ? computed : atLeast(computed, 'amber');
  return {
    id: 'cable-run',
    light,
    title: TITLE,
    customerText: customerText(light, recommended, metres, route, settings, design.charger.chosen),
    staffText: staffText(rows, recommended, metres, route, design),
    figures: {
      ...designFigures(design, route),
      lengthMetres: metres,
      sizes: rows,
      recommendedCsaMm2: recommended,
      longRunThresholdMetres: settings.longRunMetres,
      reference70C: {
        // Values from memory, not seen in the source (TABLE_4D4B_FROM_MEMORY).
        table: 'BS 7671 Table 4D4B, 70 °C thermoplastic — comparison only, not used to recommend; confirm against the printed table',
        fromMemory: true,
        sizes: design.basis.phases === 1 ? reference70CRows(design.charger.ampsPerPhase, metres, settings) : [],
      },
    },
    source: SOURCE,
    actions: actions(light, recommended, metres, route, design, settings),
  };
}

function designFigures(design: CableDesign, route: CableRoute | null) {
  return {
    currentAmps: design.charger.ampsPerPhase,
    chargerKw: design.charger.ratingKw,
    chargerChosen: design.charger.chosen,
    phases: design.basis.phases,
    deviceAmps: design.deviceAmps,
    terminalTemperatureC: design.basis.terminalTemperatureC,
    method: design.basis.method,
    capacityTable: design.basis.table,
    factors: design.basis.factors,
    factor: design.basis.factor,
    routeAssumption: design.basis.routeAssumption,
    route,
    limitPercent: design.limitPercent,
    upstreamPercent: design.upstreamPercent,
    limitVolts: design.allowedVolts,
    referenceVolts: design.referenceVolts,
    table: `${cableTableSources.drop[design.basis.phases]} (voltage drop); ${design.basis.table} (capacity)`,
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
  ratingChosen: boolean,
): string {
  if (recommended === null) {
    return `A cable run of about ${formatNumber(metres)} m is longer than any of the usual cable sizes can manage safely without losing too much voltage. Your installer will look at another spot for the charge point or another way to feed it.`;
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
  if (route === null) extra.push('Please tell us how the cable could get from your consumer unit to the charge point.');
  if (!ratingChosen) extra.push('Please choose how powerful a charge point you would like, as that decides the cable size.');
  return `${base} ${extra.join(' ')}`;
}

function staffText(
  rows: readonly CableSizeRow[],
  recommended: number | null,
  metres: number,
  route: CableRoute | null,
  design: CableDesign,
): string {
  const { basis, charger } = design;
  const table = rows
    .map((r) => `${r.csaMm2} mm² Iz ${formatNumber(r.capacityAmps, 2)} A${r.passesCapacity ? '' : ' < In'}, ${r.volts} V (${r.percent}%)${r.passesDrop ? '' : ' over'}`)
    .join('; ');
  const verdict =
    recommended === null
      ? 'No candidate size up to 25 mm² passes: consider a sub-main, relocation or a lower charger rating.'
      : `Smallest passing: ${recommended} mm².`;
  const factors = basis.factors.map((f) => `${f.name} ${f.value}`).join(', ');
  const phase = basis.phases === 3 ? 'three-phase, 4-core SWA' : 'single-phase, 2-core SWA';
  const assumed = charger.chosen ? '' : '; rating not chosen yet, assumed from settings';
  return `Ib ${charger.ampsPerPhase} A (${formatNumber(charger.ratingKw)} kW${assumed}) ≤ In ${design.deviceAmps} A ≤ Iz; ${phase}, ${basis.terminalTemperatureC} °C terminal basis, reference method ${basis.method}, factors ${factors} (product ${basis.factor}). ${basis.routeAssumption ? `${basis.routeAssumption}. ` : ''}Drop at Ib over ${formatNumber(metres)} m against ${design.limitPercent}% − ${design.upstreamPercent}% upstream = ${design.allowedVolts} V: ${table}. ${verdict} Route: ${route ? (optionWords('charger.route', route, 'staff') ?? route).toLowerCase() : 'not given'}.`;
}

function actions(
  light: Light,
  recommended: number | null,
  metres: number,
  route: CableRoute | null,
  design: CableDesign,
  settings: ReadinessSettings,
): string[] {
  if (light === 'green') return [];
  const list: string[] = [];
  if (recommended === null) list.push('The surveyor to consider a charger position closer to the consumer unit, or another supply arrangement.');
  if (route === null) list.push('Choose how the cable could run from the consumer unit to the charge point.');
  if ((route !== null && COSTLY_ROUTES.includes(route)) || metres > settings.longRunMetres) {
    list.push('The office to price the longer or more complex route at survey.');
  }
  if (!design.charger.chosen) list.push('Choose the charge point rating (3.6, 7.4, 11 or 22 kW).');
  return list;
}

function unknownLengthResult(route: CableRoute | null, design: CableDesign): CheckResult {
  return {
    id: 'cable-run',
    light: 'amber',
    title: TITLE,
    customerText: 'Please give a rough estimate of the cable length from your consumer unit to where you would like the charge point — pacing it out is fine.',
    staffText: `Cable run length not given; sizes not computed (Ib ${design.charger.ampsPerPhase} A, In ${design.deviceAmps} A, method ${design.basis.method}). Route: ${route ? (optionWords('charger.route', route, 'staff') ?? route).toLowerCase() : 'not given'}.`,
    figures: { ...designFigures(design, route), lengthMetres: null, sizes: [], recommendedCsaMm2: null },
    source: SOURCE,
    actions: ['Estimate the cable length from the consumer unit to the charge point.'],
  };
}
