// GB registration marks: pure and client-safe. Source: DVLA INF104 as summarised in
// /work/shared/TRADE-REFERENCE.md. Rules the reference does not state are marked "from memory".

export type RegistrationFormat = 'current' | 'suffix' | 'prefix' | 'dateless' | 'northern-ireland' | 'unknown';

export type RegistrationResult =
  | { ok: true; registration: string; format: RegistrationFormat; warning?: string }
  | { ok: false; message: string };

type Recognised = { registration: string; format: RegistrationFormat; warning?: string };

// INF104: the current format began in September 2001 (first age identifier 51).
const CURRENT_FORMAT_START = Date.UTC(2001, 8, 1);

// Every format the reference lists has at most seven characters, so a longer mark is impossible.
const MAX_CHARACTERS = 7;

const UNKNOWN_WARNING =
  'This does not match the usual GB number plate formats. If it is right, carry on; otherwise please check it against your V5C.';

/**
 * Checks a GB registration mark and writes it the usual way: upper case, one space.
 * `today` decides which age identifiers have been issued yet.
 *
 * @example checkRegistration('ab12cde', new Date('2026-12-01'))
 * // { ok: true, registration: 'AB12 CDE', format: 'current' }
 */
export function checkRegistration(input: string, today: Date = new Date()): RegistrationResult {
  // Checked before upper-casing, which would turn some non-ASCII letters into ASCII ones.
  if (/[^A-Za-z0-9\s]/.test(input)) {
    return { ok: false, message: 'A number plate has only letters and numbers. Please leave out any other marks.' };
  }
  const spaced = input.trim().toUpperCase().replace(/\s+/g, ' ');
  const compact = spaced.replace(/ /g, '');
  if (compact.length === 0) return { ok: false, message: 'Please enter the registration number.' };
  if (compact.length > MAX_CHARACTERS) {
    return { ok: false, message: `A GB number plate has at most seven letters and numbers; this has ${compact.length}. Please check it.` };
  }
  return { ok: true, ...recognise(compact, today, spaced) };
}

// Tries each format in turn; a mark none of them fits is kept as typed, with a warning.
function recognise(compact: string, today: Date, spaced: string): Recognised {
  return (
    asCurrent(compact, today) ??
    asSuffix(compact) ??
    asPrefix(compact) ??
    asNorthernIreland(compact) ??
    asDateless(compact) ?? { registration: spaced, format: 'unknown', warning: UNKNOWN_WARNING }
  );
}

// INF104 current format: two letters, two-digit age identifier, space, three letters (AB12 CDE).
function asCurrent(compact: string, today: Date): Recognised | null {
  const match = /^([A-Z]{2})(\d{2})([A-Z]{3})$/.exec(compact);
  if (!match) return null;
  const [, memoryTag, age, random] = match as unknown as [string, string, string, string];
  const warning = ageIdentifierWarning(age, today) ?? currentLettersWarning(memoryTag, random);
  return { registration: `${memoryTag}${age} ${random}`, format: 'current', ...(warning ? { warning } : {}) };
}

// INF104 suffix format, 1963–82: three letters, one to three digits, a year letter (ABC 123A).
function asSuffix(compact: string): Recognised | null {
  const match = /^([A-Z]{3})(\d{1,3}[A-Z])$/.exec(compact);
  if (!match) return null;
  const warning = yearLetterWarning(match[2]!.slice(-1), SUFFIX_UNUSED, 'last');
  return { registration: `${match[1]} ${match[2]}`, format: 'suffix', ...(warning ? { warning } : {}) };
}

// INF104 prefix format, 1983–2001: a year letter, one to three digits, three letters (A123 ABC).
function asPrefix(compact: string): Recognised | null {
  const match = /^([A-Z]\d{1,3})([A-Z]{3})$/.exec(compact);
  if (!match) return null;
  const warning = yearLetterWarning(match[1]!.charAt(0), PREFIX_UNUSED, 'first');
  return { registration: `${match[1]} ${match[2]}`, format: 'prefix', ...(warning ? { warning } : {}) };
}

// From memory (INF104 as summarised does not list them): year letters skipped I, O, U and Z,
// and the suffix series Q too; a prefix Q marks a vehicle of unknown age, so it is not warned.
const SUFFIX_UNUSED = /[IOQUZ]/;
const PREFIX_UNUSED = /[IOUZ]/;

function yearLetterWarning(letter: string, unused: RegExp, where: 'first' | 'last'): string | null {
  if (!unused.test(letter)) return null;
  return `The ${where} letter of this kind of number plate gives the year, and ${letter} was not used for that. Is it a number, or another letter? Please check it against your V5C.`;
}

// Rule used (from memory, INF104 only says NI "uses its own system"): one to three letters then
// one to four digits, where the last two letters hold I or Z — letters that the old GB area codes
// left to Ireland. Example: ABZ 1234.
function asNorthernIreland(compact: string): Recognised | null {
  const match = /^([A-Z]{1,3})(\d{1,4})$/.exec(compact);
  if (!match || match[1]!.length < 2 || !/[IZ]/.test(match[1]!.slice(-2))) return null;
  return { registration: `${match[1]} ${match[2]}`, format: 'northern-ireland' };
}

// Dateless marks (INF104 names them; the shape is from memory): 1–3 letters and 1–4 digits,
// either way round (ABC 123, 123 ABC).
function asDateless(compact: string): Recognised | null {
  const match = /^([A-Z]{1,3})(\d{1,4})$/.exec(compact) ?? /^(\d{1,4})([A-Z]{1,3})$/.exec(compact);
  return match ? { registration: `${match[1]} ${match[2]}`, format: 'dateless' } : null;
}

/**
 * When an age identifier could first appear: March codes are the year's last two digits,
 * September codes the year + 50 (INF104). 50 (March 2050) and 00 (September 2050) follow the
 * same scheme from memory.
 *
 * @example ageIdentifierStart('76') // Date.UTC(2026, 8, 1), 1 September 2026
 */
export function ageIdentifierStart(age: string): number {
  const code = Number(age);
  if (code === 0) return Date.UTC(2050, 8, 1);
  if (code <= 50) return Date.UTC(2000 + code, 2, 1);
  return Date.UTC(2000 + code - 50, 8, 1);
}

// A possible but unissued age identifier is more likely a typo than a real plate: warn, not refuse.
function ageIdentifierWarning(age: string, today: Date): string | null {
  const start = ageIdentifierStart(age);
  if (start < CURRENT_FORMAT_START) {
    return `The age identifier ${age} in this registration was never issued, so a digit may be mistyped. Please check it against your V5C.`;
  }
  if (start > today.getTime()) {
    return `The age identifier ${age} in this registration is not in use yet. Please check it against your V5C.`;
  }
  return null;
}

// From memory (not in the trade reference): the two-letter memory tag never uses I, Q or Z,
// and the three random letters never use I or Q (Z is used there).
function currentLettersWarning(memoryTag: string, random: string): string | null {
  const tag = /[IQZ]/.exec(memoryTag)?.[0];
  if (tag) {
    return `The first two letters of a current number plate never include ${tag}. Is it a 1, a 0, a 2 or another letter? Please check it against your V5C.`;
  }
  const last = /[IQ]/.exec(random)?.[0];
  if (last) return `The last three letters of a current number plate never include ${last}. Is it a 1 or a 0? Please check it against your V5C.`;
  return null;
}
