// Assessed maximum demand: existing loads after household diversity (IET On-Site Guide Table
// A2, each rule named), plus the new charger at full load (722.311), per phase on a
// three-phase supply. A measured maximum demand recorded by the office or surveyor replaces
// the estimate of the existing loads. Shared by supply-headroom, network-operator and timing.
import { countOf } from '@/lib/grammar';
import { chargerRating, knownPhases, type ChargerRating } from './charger';
import { COMMON_PRACTICE, type ReadinessSettings } from './settings';
import type { ChecklistAnswers, LoadAnswers, SiteMeasures } from './types';
import { formatNumber, kwToAmps, positiveOrNull, roundTo } from './units';

// The Table A2 rules were read as reproduced in The Electrician's Guide (EPA Press, Table 6.2);
// the On-Site Guide's own wording was not seen. Staff read the published table it reproduces.
export const TABLE_A2 = 'IET On-Site Guide Appendix A, Table A2';
export const REG_722_311 = 'BS 7671:2018+A2:2022 Regulation 722.311';

/** The load questions; loads count as declared only when every one has an answer. */
export const loadQuestionKeys = [
  'showerKw',
  'cooker',
  'immersion',
  'heatPumpKw',
  'storageHeaters',
  'otherEvCharger',
  'solarPv',
  'socketCircuits',
] as const satisfies readonly (keyof LoadAnswers)[];

/** One line of the working: what was declared, what it was allowed, and by which rule. */
export interface DemandItem {
  load: string;
  declared: string;
  allowanceAmps: number;
  rule: string;
  /** Which phase the item was placed on, on a three-phase supply (1, 2 or 3). */
  phase?: number;
}

export interface DemandAssessment {
  items: DemandItem[];
  /** 'measured' when staff recorded a maximum demand from smart-meter or logger data. */
  basis: 'estimated' | 'measured';
  /** Existing loads after diversity (highest phase on three phases), before the new charger. */
  existingDemandAmps: number;
  /** The new charger's current per phase. */
  chargerAmps: number;
  charger: ChargerRating;
  /** 1 or 3; an unsure or unanswered supply is assessed as single phase. */
  supplyPhases: 1 | 3;
  /** The demand on the worst phase with the new charger at full load. */
  assessedDemandAmps: number;
  /** Per-phase demand with the charger, three-phase supplies only. */
  phaseDemandAmps: number[] | null;
  /**
   * The least the demand can be given what is known: the socket count at one circuit where it
   * is not known, and a 16 A charger until a rating is chosen. Used to say "over the fuse" only
   * when it is known to be.
   */
  lowerBoundDemandAmps: number;
  /** True only when every load question has an answer. */
  loadsDeclared: boolean;
  /**
   * True when the figure is an honest estimate (all loads declared, socket circuits counted) or
   * measured, and the charger is chosen or assumed at the 32 A most a single-phase one draws.
   */
  firm: boolean;
  /** Assumptions the figure rests on, in words. */
  assumptions: string[];
}

/**
 * Instantaneous water heaters (showers): 100% of the largest, 100% of the second, 25% of the rest.
 * Source: IET On-Site Guide Appendix A, Table A2.
 *
 * @example showerAllowanceAmps([45.65, 40, 30]) // 45.65 + 40 + 7.5 = 93.15
 */
export function showerAllowanceAmps(showerAmps: readonly number[]): number {
  const [largest = 0, second = 0, ...rest] = [...showerAmps].sort((a, b) => b - a);
  return largest + second + 0.25 * rest.reduce((sum, amps) => sum + amps, 0);
}

/**
 * Cookers: 10 A + 30% of the balance, + 5 A if the control unit has a socket outlet.
 * Source: IET On-Site Guide Appendix A, Table A2.
 *
 * @example cookerAllowanceAmps(43.48, false) // 10 + 0.3 × 33.48 = 20.04
 */
export function cookerAllowanceAmps(cookerAmps: number, unitHasSocket: boolean): number {
  const firstTen = Math.min(cookerAmps, 10);
  const balance = Math.max(cookerAmps - 10, 0);
  return firstTen + 0.3 * balance + (unitHasSocket ? 5 : 0);
}

/**
 * Socket-outlet circuits: 100% of the largest circuit plus 40% of every other.
 * Source: IET On-Site Guide Appendix A, Table A2.
 *
 * @example socketAllowanceAmps(3, 32) // 32 + 0.4 × 32 × 2 = 57.6
 */
export function socketAllowanceAmps(circuits: number, circuitAmps: number): number {
  if (circuits <= 0) return 0;
  return circuitAmps + 0.4 * circuitAmps * (circuits - 1);
}

/**
 * Lighting: 66% of the total connected lighting load. Source: IET On-Site Guide Table A2.
 *
 * @example lightingAllowanceAmps(2, 230) // 0.66 × 2000 / 230 = 5.739
 */
export function lightingAllowanceAmps(lightingKw: number, voltage: number): number {
  return 0.66 * kwToAmps(lightingKw, voltage);
}

/**
 * Whether every load question has an answer (a blank or cleared field is not an answer).
 *
 * @example loadsAllAnswered({ showerKw: 10.5 }) // false
 */
export function loadsAllAnswered(loads: LoadAnswers | null | undefined): boolean {
  if (!loads) return false;
  return loadQuestionKeys.every((key) => loads[key] !== undefined && loads[key] !== null);
}

/**
 * Works out the assessed maximum demand, item by item.
 *
 * @example assessMaximumDemand({ supply: { loads: { showerKw: 10.5 } } }, {}, defaultReadinessSettings).lowerBoundDemandAmps
 * // 32 (one socket circuit) + 5.74 lighting + 45.65 shower + 32 charger = 115.39
 */
export function assessMaximumDemand(
  answers: ChecklistAnswers,
  site: SiteMeasures,
  settings: ReadinessSettings,
): DemandAssessment {
  const loads = answers.supply?.loads ?? {};
  const charger = chargerRating(answers, settings);
  const supplyPhases = knownPhases(answers) === 3 ? 3 : 1;
  const measured = positiveOrNull(site.measuredMaxDemandAmps);
  const loadsDeclared = loadsAllAnswered(answers.supply?.loads);
  const socketsCounted = typeof loads.socketCircuits === 'number';
  const existing = measured !== null ? [measuredItem(measured)] : estimatedItems(loads, settings, settings.assumedSocketCircuits);
  const lowest = measured !== null ? existing : estimatedItems(loads, settings, 1);
  const assumptions = assumptionsFor(loads, measured, settings, charger, answers);
  const worst = phaseDemand(existing, charger, supplyPhases);
  // Until a rating is chosen the least the charger could draw is the smallest offered, 16 A.
  const leastCharger = charger.chosen ? charger : { ...charger, ampsPerPhase: Math.min(charger.ampsPerPhase, 16) };
  const least = phaseDemand(lowest, leastCharger, supplyPhases);
  return {
    items: [...worst.items, chargerItem(charger)].map(toDemandItem),
    basis: measured !== null ? 'measured' : 'estimated',
    existingDemandAmps: roundTo(worst.existingWorst, 2),
    chargerAmps: charger.ampsPerPhase,
    charger,
    supplyPhases,
    assessedDemandAmps: roundTo(worst.withCharger, 2),
    phaseDemandAmps: supplyPhases === 3 ? worst.phases.map((amps) => roundTo(amps, 2)) : null,
    lowerBoundDemandAmps: roundTo(least.withCharger, 2),
    loadsDeclared,
    // An assumed charger of 32 A is the most a single-phase point draws, so the figure cannot be
    // low; an assumed 16 A could be, so it is not firm.
    firm: (measured !== null || (loadsDeclared && socketsCounted)) && (charger.chosen || charger.ampsPerPhase >= 32),
    assumptions,
  };
}

// Kept unrounded until the end so the total is not the sum of rounded parts.
interface RawItem {
  load: string;
  declared: string;
  amps: number;
  rule: string;
  phase?: number;
}

function toDemandItem(item: RawItem): DemandItem {
  return {
    load: item.load,
    declared: item.declared,
    allowanceAmps: roundTo(item.amps, 2),
    rule: item.rule,
    ...(item.phase ? { phase: item.phase } : {}),
  };
}

// Single-phase loads on a three-phase supply: placed largest first on the least-loaded phase
// (the balance an installer aims for; common practice), then a single-phase charger goes on the
// busiest phase and a three-phase one on all three, so the worst phase is not understated.
function phaseDemand(items: readonly RawItem[], charger: ChargerRating, supplyPhases: 1 | 3) {
  if (supplyPhases === 1) {
    const existing = items.reduce((total, item) => total + item.amps, 0);
    return { items: [...items], existingWorst: existing, withCharger: existing + charger.ampsPerPhase, phases: [existing] };
  }
  const phases = [0, 0, 0];
  const placed = [...items]
    .sort((a, b) => b.amps - a.amps)
    .map((item) => {
      if (item.amps === 0) return item;
      const index = phases.indexOf(Math.min(...phases));
      phases[index] = (phases[index] as number) + item.amps;
      return { ...item, phase: index + 1 };
    });
  const existingWorst = Math.max(...phases);
  const busiest = phases.indexOf(existingWorst);
  const withCharger = phases.map((amps, i) => amps + (charger.phases === 3 || i === busiest ? charger.ampsPerPhase : 0));
  return { items: placed, existingWorst, withCharger: Math.max(...withCharger), phases: withCharger };
}

function estimatedItems(loads: LoadAnswers, settings: ReadinessSettings, socketsIfUnknown: number): RawItem[] {
  return [
    socketItem(loads.socketCircuits, settings, socketsIfUnknown),
    lightingItem(settings),
    showerItem(loads.showerKw, settings),
    cookerItem(loads.cooker, settings),
    immersionItem(loads.immersion, settings),
    heatPumpItem(loads.heatPumpKw, settings),
    storageItem(loads.storageHeaters, settings),
    otherChargerItem(loads.otherEvCharger, settings),
    solarItem(loads.solarPv),
  ].filter((item): item is RawItem => item !== null);
}

function assumptionsFor(
  loads: LoadAnswers,
  measured: number | null,
  settings: ReadinessSettings,
  charger: ChargerRating,
  answers: ChecklistAnswers,
): string[] {
  const list: string[] = [];
  if (!charger.chosen) list.push(`Charge point rating not chosen: ${charger.ampsPerPhase} A single phase assumed from settings.`);
  if (answers.supply?.phases !== 'single' && answers.supply?.phases !== 'three') list.push('Supply phases not known: assessed as single phase.');
  if (answers.supply?.phases === 'three') list.push('Three-phase supply: existing loads spread largest first over the least-loaded phase (common practice); figures are for the busiest phase.');
  if (measured !== null) return list;
  if (typeof loads.socketCircuits !== 'number') {
    list.push(`Socket circuits not counted: ${settings.assumedSocketCircuits} assumed for the estimate, 1 for the least it could be.`);
  }
  if (!loadsAllAnswered(loads)) list.push('Not every load question is answered: unanswered loads count as none, so the estimate may be low.');
  return list;
}

function measuredItem(amps: number): RawItem {
  return {
    load: 'Existing maximum demand, measured',
    declared: `${formatNumber(amps, 2)} A recorded by the office or surveyor`,
    amps,
    rule: 'Measured maximum demand (smart-meter or logger data) — replaces the Table A2 estimate of the existing loads',
  };
}

function ampsText(kw: number, settings: ReadinessSettings): string {
  return `${kw} kW = ${formatNumber(kwToAmps(kw, settings.nominalVoltage), 2)} A at ${settings.nominalVoltage} V`;
}

function socketItem(socketCircuits: LoadAnswers['socketCircuits'], settings: ReadinessSettings, ifUnknown: number): RawItem {
  const counted = typeof socketCircuits === 'number';
  const circuits = counted ? socketCircuits : ifUnknown;
  const declared = counted
    ? `${countOf(circuits, 'circuit')} counted, each assumed ${settings.socketCircuitAmps} A (${COMMON_PRACTICE})`
    : `${socketCircuits === 'unsure' ? 'not sure' : 'not answered'}: ${circuits} assumed, each ${settings.socketCircuitAmps} A (${COMMON_PRACTICE})`;
  return {
    load: 'Socket-outlet circuits',
    declared,
    amps: socketAllowanceAmps(circuits, settings.socketCircuitAmps),
    rule: `Standard circuits and socket outlets: 100% of the largest + 40% of every other — ${TABLE_A2}`,
  };
}

function lightingItem(settings: ReadinessSettings): RawItem {
  return {
    load: 'Lighting',
    declared: `not asked: ${ampsText(settings.lightingKw, settings)} connected assumed (${COMMON_PRACTICE})`,
    amps: lightingAllowanceAmps(settings.lightingKw, settings.nominalVoltage),
    rule: `Lighting: 66% of total demand — ${TABLE_A2}`,
  };
}

function showerItem(showerKw: number | null | undefined, settings: ReadinessSettings): RawItem | null {
  const kw = positiveOrNull(showerKw);
  if (kw === null) return null;
  return {
    load: 'Electric shower',
    declared: ampsText(kw, settings),
    amps: showerAllowanceAmps([kwToAmps(kw, settings.nominalVoltage)]),
    rule: `Instantaneous water heater: 100% of the largest — ${TABLE_A2}`,
  };
}

function cookerItem(cooker: boolean | null | undefined, settings: ReadinessSettings): RawItem | null {
  if (cooker !== true) return null;
  const socket = settings.cookerUnitHasSocket ? ' + 5 A for the socket' : '';
  return {
    load: 'Electric cooker',
    declared: `yes (assumed ${ampsText(settings.cookerKw, settings)}; rating assumed: ${COMMON_PRACTICE})`,
    amps: cookerAllowanceAmps(kwToAmps(settings.cookerKw, settings.nominalVoltage), settings.cookerUnitHasSocket),
    rule: `Cooker: 10 A + 30% of the balance${socket} — ${TABLE_A2}`,
  };
}

function immersionItem(immersion: boolean | null | undefined, settings: ReadinessSettings): RawItem | null {
  if (immersion !== true) return null;
  return {
    load: 'Immersion heater',
    declared: `yes (assumed ${ampsText(settings.immersionKw, settings)}; rating assumed: ${COMMON_PRACTICE})`,
    amps: kwToAmps(settings.immersionKw, settings.nominalVoltage),
    rule: `Thermostatic water heater: 100% — ${TABLE_A2}`,
  };
}

// A heat pump runs for hours on cold evenings, just when a car charges: taken at 100%.
function heatPumpItem(heatPumpKw: number | null | undefined, settings: ReadinessSettings): RawItem | null {
  const kw = positiveOrNull(heatPumpKw);
  if (kw === null) return null;
  return {
    load: 'Heat pump',
    declared: ampsText(kw, settings),
    amps: kwToAmps(kw, settings.nominalVoltage),
    rule: `Thermostatically controlled heating: 100% (our conservative choice; it runs for long periods) — ${TABLE_A2}`,
  };
}

function storageItem(storageKw: number | null | undefined, settings: ReadinessSettings): RawItem | null {
  const kw = positiveOrNull(storageKw);
  if (kw === null) return null;
  return {
    load: 'Storage heaters',
    declared: `${ampsText(kw, settings)} in total`,
    amps: kwToAmps(kw, settings.nominalVoltage),
    rule: `Thermal storage heating: 100% — ${TABLE_A2}`,
  };
}

function otherChargerItem(other: boolean | null | undefined, settings: ReadinessSettings): RawItem | null {
  if (other !== true) return null;
  return {
    load: 'Existing EV charger',
    declared: `yes (assumed ${settings.otherEvChargerAmps} A; ${COMMON_PRACTICE})`,
    amps: settings.otherEvChargerAmps,
    rule: `EV charging point: full rated current, no diversity — ${REG_722_311}`,
  };
}

// Listed so the reader sees it was considered: the sun is down when most cars charge.
function solarItem(solarPv: boolean | null | undefined): RawItem | null {
  if (solarPv !== true) return null;
  return {
    load: 'Solar PV or battery',
    declared: 'yes',
    amps: 0,
    rule: 'Does not reduce demand: generation can be absent at night and on winter evenings, and a battery can be flat, just when charging is likely',
  };
}

function chargerItem(charger: ChargerRating): RawItem {
  const phases = charger.phases === 3 ? ' per phase, three phase' : ', single phase';
  const assumed = charger.chosen ? '' : ' — rating not chosen yet, assumed from settings';
  return {
    load: 'New charge point',
    declared: `${formatNumber(charger.ratingKw)} kW: ${charger.ampsPerPhase} A${phases}${assumed}`,
    amps: charger.ampsPerPhase,
    rule: `EV charging point: full rated current, no diversity — ${REG_722_311}`,
  };
}
