// The survey pack's words: staff labels for each checklist answer and its value in trade terms,
// shared by the pack page and the PDF so both say the same. Pure and client-safe.
import { fieldLabel } from '../../lib/field-labels';
import type { Light } from '../../lib/readiness/types';
import { uploadKindInfo, type UploadKind } from '../../lib/schemas/uploads';

/** The word for each light, as staff read it (always shown beside the colour and an icon). */
export { staffLightWords as lightWords } from '../../lib/readiness/lights';

/** Short staff labels; anything not listed falls back to the checklist's own field label. */
const staffLabels: Record<string, string> = {
  'about.fullName': 'Name',
  'about.email': 'E-mail',
  'about.phone': 'Phone',
  'about.addressLine1': 'Address line 1',
  'about.addressLine2': 'Address line 2',
  'about.town': 'Town',
  'about.postcode': 'Postcode',
  'about.tenure': 'Owner or tenant',
  'about.propertyType': 'Property',
  'vehicle.make': 'Make',
  'vehicle.model': 'Model',
  'vehicle.condition': 'New or used',
  'vehicle.registration': 'Registration',
  'vehicle.vin': 'VIN',
  'vehicle.deliveryDate': 'Expected delivery',
  'vehicle.connector': 'Connector',
  'vehicle.chargePort': 'Charge port on the car',
  'supply.mpanCore': 'MPAN core',
  'supply.mainFuseAmps': 'Main fuse (cut-out), as read',
  'supply.looped': 'Looped supply',
  'supply.consumerUnitLocation': 'Consumer unit location',
  'supply.earthing': 'Earthing, as answered',
  'supply.phases': 'Supply phases, as answered',
  'supply.loads.socketCircuits': 'Socket circuits (from the consumer unit labels)',
  'supply.loads.showerKw': 'Electric shower',
  'supply.loads.cooker': 'Electric cooker',
  'supply.loads.immersion': 'Immersion heater',
  'supply.loads.heatPumpKw': 'Heat pump',
  'supply.loads.storageHeaters': 'Storage heaters',
  'supply.loads.otherEvCharger': 'Another EV charger',
  'supply.loads.solarPv': 'Solar PV or battery',
  'parking.kind': 'Off-street parking',
  'parking.cars': 'Cars parked there',
  'parking.habit': 'Usually parked',
  'charger.location': 'Wanted charge point location',
  'charger.cableRunMetres': 'Cable run, customer’s estimate',
  'charger.route': 'Cable route',
  'charger.softGround': 'Soft ground for an electrode',
  'charger.softGroundMetres': 'Distance to soft ground',
  'charger.preference': 'Tethered or socketed',
  'charger.tetherMetres': 'Tethered cable length',
  'charger.ratingKw': 'Charge point rating wanted',
  'charger.plan': 'Driveway plan',
};

/**
 * The staff label for a dotted answer path.
 *
 * @example answerLabel('supply.mpanCore') // 'MPAN core'
 */
export function answerLabel(path: string): string {
  if (staffLabels[path]) return staffLabels[path]!;
  const [section = '', ...rest] = path.split('.');
  const label = fieldLabel(section, rest.join('.'));
  return label.charAt(0).toUpperCase() + label.slice(1);
}

const choiceWords: Record<string, Record<string, string>> = {
  'about.tenure': { owner: 'Owner', tenant: 'Tenant' },
  'about.propertyType': { house: 'House', flat: 'Flat', other: 'Other' },
  'vehicle.condition': { new: 'New', used: 'Used' },
  'vehicle.connector': { type2: 'Type 2', type1: 'Type 1', unsure: 'Not sure' },
  'vehicle.chargePort': {
    'front-left': 'Front left',
    'front-right': 'Front right',
    'front-centre': 'Front centre',
    'rear-left': 'Rear left',
    'rear-right': 'Rear right',
    'side-left': 'Left side',
    'side-right': 'Right side',
  },
  'supply.looped': { yes: 'Yes', no: 'No', unsure: 'Not sure' },
  'supply.earthing': { pme: 'PME (TN-C-S)', tns: 'TN-S', tt: 'TT', unknown: 'Does not know' },
  'supply.phases': { single: 'Single phase', three: 'Three phase', unsure: 'Not sure' },
  'supply.loads.socketCircuits': { unsure: 'Not sure' },
  'parking.kind': {
    'attached-drive': 'Driveway attached to the home',
    garage: 'Garage attached to the home',
    'detached-bay': 'Allocated bay, not attached to the home',
    none: 'None',
  },
  'parking.habit': { 'nose-in': 'Nose in', 'reverse-in': 'Reversed in', varies: 'Varies (both ways checked)' },
  'charger.route': {
    'through-wall': 'Straight through the wall',
    'along-wall': 'Along the outside wall',
    'through-house': 'Through the house',
    buried: 'Buried under the drive',
  },
  'charger.preference': { tethered: 'Tethered', socketed: 'Socketed' },
};

const kwOrNone = (n: number, suffix = '') => (n === 0 ? 'None' : `${n} kW${suffix}`);
const numberWords: Record<string, (n: number) => string> = {
  'supply.mainFuseAmps': (n) => `${n} A`,
  'supply.loads.showerKw': (n) => kwOrNone(n),
  'supply.loads.heatPumpKw': (n) => kwOrNone(n),
  'supply.loads.storageHeaters': (n) => kwOrNone(n, ' in total'),
  'charger.cableRunMetres': (n) => `${n} m`,
  'charger.softGroundMetres': (n) => `${n} m`,
  'charger.tetherMetres': (n) => `${n} m`,
  'charger.ratingKw': (n) => `${n} kW`,
};

const dateFormat = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });

/**
 * An answer in words, or null when it was not given. A saved null main fuse means the
 * customer could not read it.
 *
 * @example answerValue('supply.mainFuseAmps', null, true) // 'Could not read it'
 */
export function answerValue(path: string, value: unknown, present: boolean): string | null {
  if (path === 'supply.mainFuseAmps' && present && value === null) return 'Could not read it';
  if (value === undefined || value === null || value === '') return null;
  if (typeof value === 'boolean') return value ? 'Yes' : 'No';
  if (typeof value === 'number') return numberWords[path]?.(value) ?? String(value);
  if (typeof value === 'string') {
    if (path === 'vehicle.deliveryDate' && /^\d{4}-\d{2}-\d{2}$/.test(value)) return dateFormat.format(new Date(`${value}T00:00:00Z`));
    return choiceWords[path]?.[value] ?? value;
  }
  if (path === 'charger.plan') return 'Drawn (see cable reach)';
  return JSON.stringify(value);
}

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

export const networkRouteWords: Record<string, string> = {
  'notify-after': 'Connect & Notify: install, then notify the network operator within the notice period',
  'apply-before': 'Apply to Connect: apply to the network operator before connecting',
};

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

export const wayWords: Record<string, string> = { 'nose-in': 'Nose in', 'reverse-in': 'Reversed in' };

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
