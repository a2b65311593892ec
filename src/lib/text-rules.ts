// When Groundwork may text a customer, and what a text may keep. Pure: no database, no clock
// (the caller passes the hour), so the rules are tested on their own.
import { countOf } from './grammar';

/** A customer's text consent as stored (null: they never opted in). */
export type TextConsent = { mobile: string; consentedAt: Date; withdrawnAt: Date | null } | null;

export type TextDecision = { send: true; mobile: string } | { send: false; reason: string };

/**
 * True inside the sending window [fromHour, untilHour) in Great Britain; the same window the
 * e-mail reminders keep. A window whose end is before its start runs over midnight.
 *
 * @example withinSendingHours(8, 9, 19) // false: too early
 */
export function withinSendingHours(hour: number, fromHour: number, untilHour: number): boolean {
  if (fromHour === untilHour) return false;
  return fromHour < untilHour ? hour >= fromHour && hour < untilHour : hour >= fromHour || hour < untilHour;
}

/**
 * Whether a chase or reminder may also go as a text: only with the service on, a consent given
 * and not withdrawn, and inside the sending hours.
 *
 * @example textDecision({ enabled: true, consent: null, hour: 12, fromHour: 9, untilHour: 19 }) // { send: false, reason: 'The customer has not agreed to texts.' }
 */
export function textDecision(input: { enabled: boolean; consent: TextConsent; hour: number; fromHour: number; untilHour: number }): TextDecision {
  if (!input.enabled) return { send: false, reason: 'Text messages are switched off.' };
  if (!input.consent) return { send: false, reason: 'The customer has not agreed to texts.' };
  if (input.consent.withdrawnAt) return { send: false, reason: 'The customer has stopped texts.' };
  if (!withinSendingHours(input.hour, input.fromHour, input.untilHour)) {
    return { send: false, reason: `Texts go only between ${pad(input.fromHour)}:00 and ${pad(input.untilHour)}:00.` };
  }
  return { send: true, mobile: input.consent.mobile };
}

const pad = (h: number) => String(h).padStart(2, '0');

/** What a stored text says instead of a link: the link signs someone in, so it is never kept. */
export const LINK_PLACEHOLDER = '[sign-in link]';

/**
 * The text as it may be stored: every web address replaced by a placeholder.
 *
 * @example redactLinks('Carry on: https://a.example/x?token=1') // 'Carry on: [sign-in link]'
 */
export function redactLinks(text: string): string {
  return text.replace(/https?:\/\/\S+/g, LINK_PLACEHOLDER);
}

// Common practice — no published source: the opt-out words carriers and SMS providers honour.
const STOP_WORDS = new Set(['STOP', 'STOPALL', 'UNSUBSCRIBE', 'CANCEL', 'END', 'QUIT']);

/**
 * True when a reply asks to stop texts: its first word is STOP or one of the usual synonyms,
 * in any case, with any punctuation after it.
 *
 * @example isStopReply('stop please') // true
 */
export function isStopReply(text: string): boolean {
  const first = text.trim().split(/\s+/)[0]?.replace(/[^A-Za-z]/g, '').toUpperCase() ?? '';
  return STOP_WORDS.has(first);
}

/**
 * The short text that goes with a chase or reminder e-mail.
 *
 * @example reminderText({ firstName: 'Sam', firmName: 'Fernbrook', count: 2, url: 'https://…' })
 */
export function reminderText(input: { firstName: string; firmName: string; count: number; url: string }): string {
  const things = countOf(input.count, 'thing');
  return `${input.firmName}: hello ${input.firstName}, ${things} still needed before we can book your charge point survey. Carry on here: ${input.url} Reply STOP to stop texts.`;
}
