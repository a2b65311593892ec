// UK postcodes: pure and client-safe. Source: BS 7666 / GovTalk PostCodeType as summarised in
// /work/shared/TRADE-REFERENCE.md. GovTalk also limits the final letter of A9A and AA9A
// outward codes (from memory); that rule is not applied, so a real postcode is never refused
// on an unconfirmed rule.

export type PostcodeResult = { ok: true; postcode: string } | { ok: false; message: string };

// First letter never Q, V or X; second letter never I, J or Z.
const FIRST = '[A-PR-UWYZ]';
const SECOND = '[A-HK-Y]';

// Outward codes A9, A99, A9A, AA9, AA99, AA9A.
const OUTWARD = `(?:${FIRST}\\d{1,2}|${FIRST}\\d[A-Z]|${FIRST}${SECOND}\\d{1,2}|${FIRST}${SECOND}\\d[A-Z])`;

// Inward code: a digit and two letters, never C, I, K, M, O or V.
const INWARD = '\\d[ABD-HJLNP-UW-Z]{2}';

const POSTCODE_PATTERN = new RegExp(`^${OUTWARD}${INWARD}$`);

/**
 * Upper case with exactly one space before the three-character inward code.
 *
 * @example normalisePostcode('ls11aa') // 'LS1 1AA'
 */
export function normalisePostcode(input: string): string {
  const compact = input.replace(/\s+/g, '').toUpperCase();
  return compact.length > 3 ? `${compact.slice(0, -3)} ${compact.slice(-3)}` : compact;
}

/**
 * Checks a UK postcode by the BS 7666 pattern (GIR 0AA is the one special case).
 *
 * @example checkPostcode('ab12 3de') // { ok: true, postcode: 'AB12 3DE' }
 */
export function checkPostcode(input: string): PostcodeResult {
  const postcode = normalisePostcode(input);
  if (postcode.length === 0) return { ok: false, message: 'Please enter the postcode.' };
  if (postcode === 'GIR 0AA' || POSTCODE_PATTERN.test(postcode.replace(' ', ''))) return { ok: true, postcode };
  return { ok: false, message: 'This does not look like a UK postcode. Please check it against a letter sent to the address.' };
}
