// Dates and figures as office staff read them: short, British, and never "undefined".
import { countOf, plural as pluralWord } from '@/lib/grammar';

const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'Europe/London' });
const dayTime = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: 'Europe/London' });
const isoDay = new Intl.DateTimeFormat('en-CA', { year: 'numeric', month: '2-digit', day: '2-digit', timeZone: 'Europe/London' });

/** "4 Mar 2026" from an ISO timestamp or a YYYY-MM-DD date. @example formatDay('2026-03-04') // '4 Mar 2026' */
export function formatDay(value: string | null | undefined): string {
  if (!value) return '—';
  const d = /^\d{4}-\d{2}-\d{2}$/.test(value) ? new Date(`${value}T12:00:00Z`) : new Date(value);
  return Number.isNaN(d.getTime()) ? value : day.format(d);
}

/** "4 Mar 2026, 14:05". @example formatDayTime('2026-03-04T14:05:00Z') // '4 Mar 2026, 14:05' */
export function formatDayTime(value: string | null | undefined): string {
  if (!value) return '—';
  const d = new Date(value);
  return Number.isNaN(d.getTime()) ? value : dayTime.format(d);
}

/** Today in Great Britain as YYYY-MM-DD (the date a survey may be booked from). */
export function todayIso(now = new Date()): string {
  return isoDay.format(now);
}

/** Whole days from today (GB) to a YYYY-MM-DD date; negative when past. @example daysUntil('2026-01-10', new Date('2026-01-01T10:00Z')) // 9 */
export function daysUntil(date: string, now = new Date()): number {
  const a = Date.parse(`${todayIso(now)}T00:00:00Z`);
  const b = Date.parse(`${date}T00:00:00Z`);
  return Math.round((b - a) / 86_400_000);
}

/** "today", "yesterday", "3 days ago", "in 5 days". @example relativeDays(-3) // '3 days ago' */
export function relativeDays(n: number): string {
  if (n === 0) return 'today';
  if (n === -1) return 'yesterday';
  if (n === 1) return 'tomorrow';
  return n < 0 ? `${countOf(-n, 'day')} ago` : `in ${countOf(n, 'day')}`;
}

/** Whole days since an ISO timestamp, for "last activity". */
export function daysSince(value: string, now = new Date()): number {
  return -daysUntil(todayIso(new Date(value)), now);
}

/** A number without float noise: 2 decimals at most. @example formatNumber(45.6521) // '45.65' */
export function formatNumber(n: number, decimals = 2): string {
  return Number(n.toFixed(decimals)).toLocaleString('en-GB', { maximumFractionDigits: decimals });
}

/** "3 customers" / "1 customer", by Intl.PluralRules (src/lib/grammar.ts), with a grouped count. */
export function plural(n: number, one: string, many = `${one}s`): string {
  return `${n.toLocaleString('en-GB')} ${pluralWord(n, one, many)}`;
}
