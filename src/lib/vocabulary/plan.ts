// The plan's words: names of ports and parking ways, and the reach verdict as a sentence, so
// the drawing, the summary, the pack sketch and the tests say the same thing. The names come
// from the field vocabulary (vehicle.chargePort, parking.habit), so they match the checklist.
import type { CableSource } from '@/lib/readiness/checks/cable-reach';
import type { CarSizeClass, ReachVerdict } from '@/lib/readiness/plan';
import type { ChargePort, ParkingWay } from '@/lib/readiness/types';
import { formatNumber, roundTo } from '@/lib/readiness/units';
import { fieldWords } from './fields';

/** A field's options as value → words for one audience. */
export const optionMap = <K extends string>(options: readonly { value: string; customer: string; staff: string }[], audience: 'customer' | 'staff') =>
  Object.fromEntries(options.map((o) => [o.value, o[audience]])) as Record<K, string>;

/** Port positions as the customer reads them (left and right from the driver's seat). */
export const portLabels: Record<ChargePort, string> = optionMap<ChargePort>(fieldWords['vehicle.chargePort'].options, 'customer');

/** Port positions as staff read them. */
export const portStaffLabels: Record<ChargePort, string> = optionMap<ChargePort>(fieldWords['vehicle.chargePort'].options, 'staff');

/** The two ways of parking the reach is checked for: "Nose in", "Reversing in". */
export const wayLabels: Record<ParkingWay, string> = optionMap<ParkingWay>(fieldWords['parking.habit'].options.filter((o) => o.value !== 'varies'), 'customer');

// A figure and its unit stay on one line.
const NBSP = '\u00a0';

/** A way of parking after "when you …". */
export const wayPhrases: Record<ParkingWay, string> = { 'nose-in': 'park nose in', 'reverse-in': 'reverse in' };

export const sizeClassLabels: Record<Exclude<CarSizeClass, 'custom'>, string> = optionMap<CarSizeClass>(fieldWords['charger.plan.car.sizeClass'].options, 'customer');

/**
 * A length for reading: one decimal place, or two when one would hide which side of the cable
 * length it falls (5.04 m must not read as "5 m" when it does not reach).
 *
 * @example metres(5.04, 5) // '5.04'
 */
export function metres(value: number, cableMetres: number): string {
  const rounded = roundTo(value, 1);
  const misleads = value > cableMetres ? rounded <= cableMetres : rounded > cableMetres;
  return formatNumber(value, misleads ? 2 : 1);
}

/**
 * One parking way's verdict in words, never by colour alone.
 *
 * @example verdictSentence({ way: 'nose-in', reaches: true, requiredMetres: 3.2 } as ReachVerdict, 5)
 * // 'Reaches when you park nose in — 3.2 m of 5 m' (a no-break space before each "m")
 */
export function verdictSentence(verdict: Pick<ReachVerdict, 'way' | 'reaches' | 'requiredMetres'>, cableMetres: number): string {
  const need = metres(verdict.requiredMetres, cableMetres);
  const way = wayPhrases[verdict.way];
  return verdict.reaches
    ? `Reaches when you ${way} — ${need}${NBSP}m of ${formatNumber(cableMetres, 2)}${NBSP}m`
    : `Doesn’t reach when you ${way} — needs ${need}${NBSP}m`;
}

/**
 * What the needed length is made of, for the line under a verdict.
 *
 * @example verdictDetail({ reaches: false, planMetres: 5.1, shortByMetres: 1.1 } as ReachVerdict, 1) // '1.1 m more than the cable: 5.1 m on the plan plus 1 m slack.'
 */
export function verdictDetail(verdict: Pick<ReachVerdict, 'reaches' | 'planMetres' | 'shortByMetres'>, slackMetres: number): string {
  const made = `${formatNumber(verdict.planMetres, 1)} m on the plan plus ${formatNumber(slackMetres, 2)} m slack`;
  return verdict.reaches ? `${made}.` : `${formatNumber(Math.max(verdict.shortByMetres, 0.01), 2)} m more than the cable: ${made}.`;
}

/**
 * Which cable is measured, in words.
 *
 * @example cableSentence({ metres: 5, source: 'tether' }) // 'Your tethered cable: 5 m.'
 */
export function cableSentence(cable: { metres: number; source: CableSource }): string {
  const length = formatNumber(cable.metres, 2);
  if (cable.source === 'tether') return `Your tethered cable: ${length} m.`;
  if (cable.source === 'tether-assumed') return `A tethered cable of ${length} m, the usual length (tell us yours in the charge point step).`;
  return `Your own charging cable, as the charge point is socketed: we’ve assumed ${length} m.`;
}

/**
 * A charge port position in staff words, or "Not known"; never the saved id.
 *
 * @example portWord('side-left') // 'Left side, rear'
 */
export function portWord(port: unknown): string {
  return typeof port === 'string' && port in portStaffLabels ? portStaffLabels[port as ChargePort] : 'Not known';
}

/**
 * A way of parking in words, never the saved id.
 *
 * @example wayWord('reverse-in') // 'Reversing in'
 */
export function wayWord(way: unknown): string {
  return typeof way === 'string' && way in wayLabels ? wayLabels[way as ParkingWay] : '—';
}
