// ISO calendar dates: pure and client-safe. Source: ISO 8601 calendar date, extended format.

export type IsoDateResult = { ok: true; date: string } | { ok: false; message: string };

/**
 * Checks a YYYY-MM-DD date that exists on the calendar (so no 30 February).
 *
 * @example checkIsoDate('2028-02-29') // { ok: true, date: '2028-02-29' }
 */
export function checkIsoDate(input: string): IsoDateResult {
  const date = input.trim();
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
  if (!match) return { ok: false, message: 'Please give the date as year, month and day, for example 2027-03-15.' };
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  if (!isCalendarDate(year, month, day)) {
    return { ok: false, message: 'That date does not exist on the calendar. Please check the day and month.' };
  }
  return { ok: true, date };
}

// Setting an impossible day rolls it into the next month, so a round trip exposes it;
// setUTCFullYear (unlike Date.UTC) also keeps years 0–99 as written.
function isCalendarDate(year: number, month: number, day: number): boolean {
  const probe = new Date(0);
  probe.setUTCFullYear(year, month - 1, day);
  return probe.getUTCFullYear() === year && probe.getUTCMonth() === month - 1 && probe.getUTCDate() === day;
}
