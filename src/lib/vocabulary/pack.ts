// The survey pack's staff words: figures, bases and states in trade terms, shared by the pack
// page, the office's case page and the PDF so all three say the same. Pure and client-safe.
import { countOf } from '@/lib/grammar';
import { networkRouteNames as routeNames } from '@/lib/readiness/network-route';
import { uploadKindInfo, type UploadKind } from '@/lib/schemas/uploads';

/** The word for each light, as staff read it (always shown beside the colour and an icon). */
export { staffLightWords as lightWords } from '@/lib/readiness/lights';

/**
 * A day in words for the pack.
 *
 * @example formatDay('2026-03-12') // 'Thursday 12 March 2026'
 */
export function formatDay(iso: string | null | undefined): string {
  if (!iso) return 'Not booked';
  return new Intl.DateTimeFormat('en-GB', { weekday: 'long', day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${iso.slice(0, 10)}T00:00:00Z`));
}

/**
 * A moment in words, in GB time.
 *
 * @example formatMoment(new Date('2026-03-12T09:05:00Z')) // '12 Mar 2026, 09:05'
 */
export function formatMoment(at: Date | string): string {
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'Europe/London' }).format(new Date(at));
}

/** Staff title of an upload kind. */
export const kindTitle = (kind: UploadKind) => uploadKindInfo[kind]?.title ?? kind;

export const uploadStateWords = { accepted: 'Accepted', waiting: 'Waiting for review', rejected: 'Rejected', missing: 'Missing' } as const;

/** The network operator's two routes, named as the trade body names its process (staff only). */
export { networkRouteNames } from '@/lib/readiness/network-route';

/** Each route with what it asks of the installer, for the pack and the PDF. */
export const networkRouteWords: Record<string, string> = {
  'notify-after': `${routeNames['notify-after']}: install, then notify the network operator within the notice period`,
  'apply-before': `${routeNames['apply-before']}: apply to the network operator before connecting`,
};

/** A network route in words, never its id. */
export function networkRouteWord(route: unknown, long = false): string {
  const key = String(route ?? '');
  return (long ? networkRouteWords[key] : (routeNames as Record<string, string>)[key]) ?? 'Not settled';
}

/**
 * How the cable was sized, in one line: Ib, In, terminal basis, method and factors.
 *
 * @example cableBasisWords({ currentAmps: 32, deviceAmps: 32, terminalTemperatureC: 70, method: 'D', factor: 1, phases: 1, upstreamPercent: 0, limitPercent: 5, limitVolts: 11.5, chargerChosen: true })
 * // 'Ib 32 A ≤ In 32 A ≤ Iz; 70 °C terminals; method D; factors × 1; single phase; limit 5% − 0% upstream = 11.5 V'
 */
export function cableBasisWords(c: { currentAmps: number; deviceAmps: number | null; terminalTemperatureC: number | null; method: string | null; factor: number | null; phases: number; upstreamPercent: number; limitPercent: number; limitVolts: number; chargerChosen: boolean }): string {
  const assumed = c.chargerChosen ? '' : ' (charger rating assumed)';
  return `Ib ${fmt(c.currentAmps)} A${assumed} ≤ In ${c.deviceAmps === null ? '—' : `${fmt(c.deviceAmps)} A`} ≤ Iz; ${c.terminalTemperatureC ?? '—'} °C terminals; method ${c.method ?? '—'}; factors × ${c.factor === null ? '—' : fmt(c.factor)}; ${c.phases === 3 ? 'three phase' : 'single phase'}; limit ${fmt(c.limitPercent)}% − ${fmt(c.upstreamPercent)}% upstream = ${fmt(c.limitVolts)} V`;
}

/**
 * The demand's basis in words.
 *
 * @example demandBasisWords({ basis: 'measured', firm: true, lowerBoundDemandAmps: 73 }) // 'Measured maximum demand (smart meter or logger)'
 */
export function demandBasisWords(d: { basis: string; firm: boolean; lowerBoundDemandAmps: number | null }): string {
  if (d.basis === 'measured') return 'Measured maximum demand (smart meter or logger)';
  if (d.firm) return 'Estimated by IET On-Site Guide Table A2, every load answered';
  return `Estimated by Table A2, not firm: at least ${d.lowerBoundDemandAmps === null ? '—' : `${fmt(d.lowerBoundDemandAmps)} A`}`;
}

/**
 * The electrode test in words.
 *
 * @example electrodeTestWords({ raOhms: 250, idnMilliamps: 30, touchVolts: 7.5, passes: true, possiblyUnstable: true })
 * // 'RA 250 Ω × IΔn 30 mA = 7.5 V ≤ 50 V (411.5.3); above 200 Ω: may not be stable (common practice)'
 */
export function electrodeTestWords(t: { raOhms: number | null; idnMilliamps: number | null; touchVolts: number | null; passes: boolean | null; possiblyUnstable: boolean | null }): string {
  if (t.touchVolts === null) return `RA ${t.raOhms === null ? 'not recorded' : `${fmt(t.raOhms)} Ω`}, IΔn ${t.idnMilliamps === null ? 'not recorded' : `${fmt(t.idnMilliamps)} mA`}: not tested yet`;
  const verdict = t.passes ? '≤ 50 V (411.5.3)' : '> 50 V: fails 411.5.3';
  return `RA ${fmt(t.raOhms ?? 0)} Ω × IΔn ${fmt(t.idnMilliamps ?? 0)} mA = ${fmt(t.touchVolts)} V ${verdict}${t.possiblyUnstable ? '; above 200 Ω: may not be stable (common practice)' : ''}`;
}

export const cableSourceWords: Record<string, string> = {
  tether: 'tethered cable, as given',
  'tether-assumed': 'tethered cable, usual length assumed',
  'customer-cable-assumed': 'customer’s own cable, length assumed',
};

/**
 * "Gaps", agreed once: for staff, the readiness checks not yet green ("open checks"); for the
 * customer, the fields still to answer ("to answer").
 *
 * @example gapWords.staffOpen(1, 9) // '1 of 9 checks open'
 * @example gapWords.customerToAnswer(2) // '2 to answer'
 */
export const gapWords = {
  staffOpen: (open: number, of?: number) => (of === undefined ? countOf(open, 'open check') : `${open} of ${countOf(of, 'check')} open`),
  customerToAnswer: (n: number) => `${n} to answer`,
} as const;

/**
 * Whether every load question was answered, as staff read it (unanswered loads count as none,
 * so the demand is a lower bound).
 *
 * @example loadsDeclaredWords(false) // 'Not all: unanswered count as none'
 */
export function loadsDeclaredWords(declared: boolean): string {
  return declared ? 'Every question answered' : 'Not all: unanswered count as none';
}

export { wayLabels as wayWords } from './plan';

/**
 * A number for a table: at most `places` decimals, no trailing zeros.
 *
 * @example fmt(2.19800, 2) // '2.2'
 */
export function fmt(value: number | null | undefined, places = 2): string {
  if (typeof value !== 'number' || !Number.isFinite(value)) return '—';
  const factor = 10 ** places;
  return String(Math.round((value + Number.EPSILON) * factor) / factor);
}

/**
 * The headroom in words: spare amps against the margin, "over by" when negative, or each
 * rating's headroom when the cut-out is not known.
 *
 * @example headroomWords({ headroomAmps: -3.35, marginAmps: 10, headroomByRating: [] }) // 'Over by 3.35 A'
 */
export function headroomWords(d: { headroomAmps: number | null; marginAmps: number; headroomByRating: { rating: number; headroomAmps: number }[] }): string {
  if (d.headroomAmps === null) return `Cut-out not known; at ${d.headroomByRating.map((r) => `${r.rating} A: ${fmt(r.headroomAmps)} A`).join(', ')}`;
  if (d.headroomAmps < 0) return `Over by ${fmt(-d.headroomAmps)} A`;
  return `${fmt(d.headroomAmps)} A spare (margin ${fmt(d.marginAmps)} A)`;
}
