// VIN checks: pure and client-safe. Source: 49 CFR Part 565, §565.15 (check digit) and the
// 17-character, no I/O/Q rule, as in /work/shared/TRADE-REFERENCE.md.

export type VinResult = { ok: true; vin: string; warning?: string } | { ok: false; message: string };

// §565.15 transliteration: A=1 … H=8, J=1 … R=9 (P=7, no O or Q), S=2 … Z=9; digits are themselves.
const TRANSLITERATION: Readonly<Record<string, number>> = {
  A: 1, B: 2, C: 3, D: 4, E: 5, F: 6, G: 7, H: 8,
  J: 1, K: 2, L: 3, M: 4, N: 5, P: 7, R: 9,
  S: 2, T: 3, U: 4, V: 5, W: 6, X: 7, Y: 8, Z: 9,
};

// §565.15 weights by position 1–17; position 9 (the check digit itself) weighs 0.
const WEIGHTS = [8, 7, 6, 5, 4, 3, 2, 10, 0, 9, 8, 7, 6, 5, 4, 3, 2] as const;

const VIN_PATTERN = /^[A-HJ-NPR-Z0-9]{17}$/;

export const VIN_CHECK_DIGIT_WARNING =
  'The check character (the 9th) does not match the North American rule. Many European VINs do not use it, so this may be fine, but please check the VIN against your order form or V5C.';

/**
 * Upper case, with spaces removed, as a VIN is printed in groups on some documents.
 *
 * @example normaliseVin(' 1m8gdm9a xkp042788 ') // '1M8GDM9AXKP042788'
 */
export function normaliseVin(input: string): string {
  return input.replace(/\s+/g, '').toUpperCase();
}

/**
 * The §565.15 check character for a 17-character VIN: weighted sum mod 11, 10 written "X".
 *
 * @example vinCheckDigit('1M8GDM9AXKP042788') // 'X' (sum 351, 351 mod 11 = 10)
 */
export function vinCheckDigit(vin: string): string {
  if (!VIN_PATTERN.test(vin)) throw new RangeError('vinCheckDigit needs a normalised 17-character VIN');
  const sum = WEIGHTS.reduce<number>((total, weight, i) => total + weight * transliterate(vin[i]!), 0);
  const remainder = sum % 11;
  return remainder === 10 ? 'X' : String(remainder);
}

/**
 * Checks a VIN: 17 characters without I, O or Q; a failed North American check digit is a
 * warning only, because a European VIN need not carry one.
 *
 * @example checkVin('1M8GDM9AXKP042788') // { ok: true, vin: '1M8GDM9AXKP042788' }
 */
export function checkVin(input: string): VinResult {
  const vin = normaliseVin(input);
  const refusal = vinRefusal(vin);
  if (refusal) return { ok: false, message: refusal };
  if (vinCheckDigit(vin) !== vin[8]) return { ok: true, vin, warning: VIN_CHECK_DIGIT_WARNING };
  return { ok: true, vin };
}

// The first thing wrong with a normalised VIN, in words a customer can act on; null if none.
function vinRefusal(vin: string): string | null {
  if (vin.length === 0) return 'Please enter the 17-character VIN.';
  if (/[^A-Z0-9]/.test(vin)) return 'A VIN has letters and numbers only. Please leave out any other marks.';
  const confusable = [...new Set(vin.match(/[IOQ]/g) ?? [])];
  if (confusable.length > 0) {
    return `A VIN never contains the letters I, O or Q, and this one has ${confusable.join(', ')}. It is probably a 1 or a 0: please check it.`;
  }
  if (vin.length !== 17) return `A VIN has 17 characters; this has ${vin.length}. Please check it against your documents.`;
  return null;
}

function transliterate(char: string): number {
  return /\d/.test(char) ? Number(char) : TRANSLITERATION[char]!;
}
