// Calendar-day arithmetic on YYYY-MM-DD strings, in UTC so no time zone or clock is involved.

const MS_PER_DAY = 86_400_000;

/**
 * Days since 1970-01-01 for a real calendar date, or null for anything else.
 *
 * @example isoDayNumber('1970-01-02') // 1
 */
export function isoDayNumber(iso: string | null | undefined): number | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(iso ?? '');
  if (!match) return null;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const ms = Date.UTC(year, month - 1, day);
  const back = new Date(ms);
  // Date.UTC rolls 31 February into March; a real date survives the round trip.
  if (back.getUTCFullYear() !== year || back.getUTCMonth() !== month - 1 || back.getUTCDate() !== day) return null;
  return ms / MS_PER_DAY;
}

/**
 * The YYYY-MM-DD date for a day number.
 *
 * @example isoFromDayNumber(1) // '1970-01-02'
 */
export function isoFromDayNumber(dayNumber: number): string {
  return new Date(dayNumber * MS_PER_DAY).toISOString().slice(0, 10);
}

/**
 * Adds calendar days (weekends and bank holidays count like any other day).
 *
 * @example addDays('2025-01-31', 28) // '2025-02-28'
 */
export function addDays(iso: string, days: number): string {
  const start = isoDayNumber(iso);
  if (start === null) throw new RangeError(`Not a YYYY-MM-DD date: ${iso}`);
  return isoFromDayNumber(start + days);
}
