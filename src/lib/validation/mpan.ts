// MPAN core checks: pure and client-safe, so the form and the server apply the same rule.
// Source: the market operator's MPAN definition in the Master Registration Agreement; the
// open-source mpan reference library (limejump/mpan) agrees on the check digit.

/** Why an MPAN core was refused. */
export type MpanRefusal = 'length' | 'characters' | 'check-digit' | 'distributor';

/** How far the distributor ID is known: a GB region, a listed independent network, or not listed. */
export type DistributorStatus = 'region' | 'independent' | 'unlisted';

export type MpanResult =
  | { ok: true; core: string; distributorId: string; region: string; distributorStatus: DistributorStatus }
  | { ok: false; reason: MpanRefusal; message: string };

/** Shown instead of a region for a listed independent network operator's ID. */
export const INDEPENDENT_NETWORK = 'independent network';
/** Shown for an ID from 24 up that is not on the list below. */
export const UNLISTED_DISTRIBUTOR = 'distributor ID not on our list';

/**
 * Distributor IDs the market operator lists for independent network operators (IDNOs). From
 * memory, not seen in the published list: 24 to 37. Names are never shown, only "independent
 * network". An ID from 24 up that is not here is accepted (the check digit decides validity)
 * but shown as unlisted, amber, for the office to confirm.
 */
export const independentNetworkIds: ReadonlySet<string> = new Set(
  ['24', '25', '26', '27', '28', '29', '30', '31', '32', '33', '34', '35', '36', '37'],
);

/**
 * The 14 GB distribution regions by distributor ID (region names only, never company names).
 *
 * @example mpanRegions['23'] // 'Yorkshire'
 */
export const mpanRegions: Readonly<Record<string, string>> = Object.freeze({
  '10': 'Eastern England',
  '11': 'East Midlands',
  '12': 'London',
  '13': 'Merseyside, Cheshire and North Wales',
  '14': 'West Midlands',
  '15': 'North East England',
  '16': 'North West England',
  '17': 'North Scotland',
  '18': 'South Scotland',
  '19': 'South East England',
  '20': 'Southern England',
  '21': 'South Wales',
  '22': 'South West England',
  '23': 'Yorkshire',
});

// Weights for the first 12 digits, in order, from the published check-digit rule.
const MPAN_WEIGHTS = [3, 5, 7, 13, 17, 19, 23, 29, 31, 37, 41, 43] as const;

/**
 * Removes the spaces and hyphens people copy from a bill, leaving what they typed otherwise.
 *
 * @example normaliseMpanCore(' 13 1234 5678 907 ') // '1312345678907'
 */
export function normaliseMpanCore(input: string): string {
  return input.replace(/[\s-]+/g, '');
}

/**
 * The check digit for the first 12 digits of an MPAN core: weighted sum, mod 11, mod 10.
 *
 * @example mpanCheckDigit('131234567890') // 7 (sum 1349, 1349 mod 11 = 7)
 */
export function mpanCheckDigit(first12: string): number {
  if (!/^\d{12}$/.test(first12)) {
    throw new RangeError('mpanCheckDigit needs exactly 12 digits');
  }
  const sum = MPAN_WEIGHTS.reduce<number>((total, weight, i) => total + weight * Number(first12[i]), 0);
  return (sum % 11) % 10;
}

/**
 * The region name for a two-digit distributor ID, or null when it is not a GB distributor.
 *
 * @example regionForDistributor('24') // 'independent network'
 * @example regionForDistributor('99') // 'distributor ID not on our list'
 */
export function regionForDistributor(distributorId: string): string | null {
  const status = distributorStatus(distributorId);
  if (status === null) return null;
  if (status === 'region') return mpanRegions[distributorId] as string;
  return status === 'independent' ? INDEPENDENT_NETWORK : UNLISTED_DISTRIBUTOR;
}

/**
 * Whether an ID is one of the 14 regions (10–23), a listed independent network, or unlisted.
 *
 * @example distributorStatus('38') // 'unlisted'
 */
export function distributorStatus(distributorId: string): DistributorStatus | null {
  if (!/^\d{2}$/.test(distributorId) || Number(distributorId) < 10) return null;
  if (mpanRegions[distributorId]) return 'region';
  return independentNetworkIds.has(distributorId) ? 'independent' : 'unlisted';
}

/**
 * Checks a 13-digit MPAN core: digits only, length, distributor ID and check digit.
 *
 * @example checkMpanCore('13 1234 5678 907')
 * // { ok: true, core: '1312345678907', distributorId: '13', region: 'Merseyside, Cheshire and North Wales' }
 */
export function checkMpanCore(input: string): MpanResult {
  const core = normaliseMpanCore(input);
  if (!/^\d*$/.test(core)) {
    return refuse('characters', 'An MPAN core is made of digits only. Please check for a letter, such as O typed for a zero.');
  }
  if (core.length !== 13) return refuse('length', lengthMessage(core.length));
  const distributorId = core.slice(0, 2);
  const region = regionForDistributor(distributorId);
  if (region === null) {
    return refuse('distributor', `An MPAN core starts with a distributor number from 10 upwards, not ${distributorId}. Please check you have copied the 13-digit core from the bottom line.`);
  }
  if (mpanCheckDigit(core.slice(0, 12)) !== Number(core[12])) {
    return refuse('check-digit', 'This MPAN core does not add up: one digit is probably mistyped. Please check it against your electricity bill.');
  }
  return { ok: true, core, distributorId, region, distributorStatus: distributorStatus(distributorId) as DistributorStatus };
}

function refuse(reason: MpanRefusal, message: string): MpanResult {
  return { ok: false, reason, message };
}

// A 21-digit entry is usually the whole MPAN, top line included: point people at the core.
function lengthMessage(length: number): string {
  if (length === 0) return 'Please enter the 13-digit MPAN core from your electricity bill.';
  if (length === 21) {
    return 'That looks like the full 21-digit MPAN. Please enter only the 13-digit core: the bottom line of the box on your bill.';
  }
  return `An MPAN core has 13 digits; this has ${length}. Please check it against your electricity bill.`;
}
