// Assessed maximum demand: existing loads after household diversity, plus the new charger at
// full load. Shared by supply-headroom, network-operator and timing so they agree.
import { COMMON_PRACTICE, type ReadinessSettings } from './settings';
import type { LoadAnswers } from './types';
import { formatNumber, kwToAmps, positiveOrNull, roundTo } from './units';

export const TABLE_A2 = "IET On-Site Guide Appendix A, Table A2 (as reproduced in The Electrician's Guide, Table 6.2)";
export const REG_722_311 = 'BS 7671:2018+A2:2022 Regulation 722.311';

/** One line of the working: what was declared, what it was allowed, and by which rule. */
export interface DemandItem {
  load: string;
  declared: string;
  allowanceAmps: number;
  rule: string;
}

export interface DemandAssessment {
  items: DemandItem[];
  /** Existing loads after diversity, before the new charger. */
  existingDemandAmps: number;
  chargerAmps: number;
  assessedDemandAmps: number;
  /** False when the customer has not answered the loads question at all. */
  loadsDeclared: boolean;
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
 * Works out the assessed maximum demand, item by item.
 *
 * @example assessMaximumDemand({ showerKw: 10.5 }, defaultReadinessSettings).assessedDemandAmps
 * // 10 baseline + 45.65 shower + 32 charger = 87.65
 */
export function assessMaximumDemand(
  loads: LoadAnswers | null | undefined,
  settings: ReadinessSettings,
): DemandAssessment {
  const declared = loads ?? {};
  const existing = [
    baselineItem(settings),
    showerItem(declared.showerKw, settings),
    cookerItem(declared.cooker, settings),
    immersionItem(declared.immersion, settings),
    heatPumpItem(declared.heatPumpKw, settings),
    storageItem(declared.storageHeaters, settings),
    otherChargerItem(declared.otherEvCharger, settings),
    solarItem(declared.solarPv),
  ].filter((item): item is RawItem => item !== null);
  const charger = chargerItem(settings);
  const existingDemandAmps = sum(existing);
  const assessedDemandAmps = existingDemandAmps + charger.amps;
  return {
    items: [...existing, charger].map(toDemandItem),
    existingDemandAmps: roundTo(existingDemandAmps, 2),
    chargerAmps: roundTo(charger.amps, 2),
    assessedDemandAmps: roundTo(assessedDemandAmps, 2),
    loadsDeclared: loads !== null && loads !== undefined,
  };
}

// Kept unrounded until the end so the total is not the sum of rounded parts.
interface RawItem {
  load: string;
  declared: string;
  amps: number;
  rule: string;
}

function toDemandItem(item: RawItem): DemandItem {
  return { load: item.load, declared: item.declared, allowanceAmps: roundTo(item.amps, 2), rule: item.rule };
}

function sum(items: readonly RawItem[]): number {
  return items.reduce((total, item) => total + item.amps, 0);
}

function ampsText(kw: number, settings: ReadinessSettings): string {
  return `${kw} kW = ${formatNumber(kwToAmps(kw, settings.nominalVoltage), 2)} A at ${settings.nominalVoltage} V`;
}

// The checklist does not ask for circuit ratings, so Table A2's socket rule cannot be applied.
function baselineItem(settings: ReadinessSettings): RawItem {
  return {
    load: 'Lighting, sockets and small appliances',
    declared: 'always present',
    amps: settings.baselineAmps,
    rule: `Fixed allowance from settings — ${COMMON_PRACTICE}`,
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

function chargerItem(settings: ReadinessSettings): RawItem {
  return {
    load: 'New charge point',
    declared: `${settings.chargerAmps} A (≈ ${formatNumber((settings.chargerAmps * settings.nominalVoltage) / 1000)} kW)`,
    amps: settings.chargerAmps,
    rule: `EV charging point: full rated current, no diversity — ${REG_722_311}`,
  };
}
