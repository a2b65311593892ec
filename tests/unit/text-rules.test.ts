import { describe, expect, it } from 'vitest';
import { parsePhoneNumberFromString } from 'libphonenumber-js/max';
import { isStopReply, redactLinks, textDecision, withinSendingHours } from '@/lib/text-rules';
import { checkUkMobile } from '@/lib/validation/phone';
import { textConsentSchema } from '@/lib/schemas/texts';

// Consent: UK rules on marketing by text (PECR reg. 22, from memory) need a freely given, specific
// yes; a reminder about a job the customer asked for is service, but Groundwork still texts only
// after an explicit opt-in and stops on STOP at once. Quiet hours are the e-mail reminders'
// window (Settings, 09:00–19:00 in Great Britain by default): common practice — no published source.

const consent = { mobile: '+447400123456', consentedAt: new Date('2026-12-01T10:00:00Z'), withdrawnAt: null };
const window = { fromHour: 9, untilHour: 19 };

describe('textDecision', () => {
  it('never texts someone who has not opted in', () => {
    expect(textDecision({ enabled: true, consent: null, hour: 12, ...window })).toEqual({ send: false, reason: 'The customer has not agreed to texts.' });
  });

  it('never texts after consent is withdrawn', () => {
    const withdrawn = { ...consent, withdrawnAt: new Date('2026-12-02T10:00:00Z') };
    expect(textDecision({ enabled: true, consent: withdrawn, hour: 12, ...window })).toMatchObject({ send: false, reason: 'The customer has stopped texts.' });
  });

  it('sends nothing when the service is off, whatever the consent', () => {
    expect(textDecision({ enabled: false, consent, hour: 12, ...window })).toMatchObject({ send: false, reason: 'Text messages are switched off.' });
  });

  it('texts the consented mobile inside the window, not outside it', () => {
    expect(textDecision({ enabled: true, consent, hour: 9, ...window })).toEqual({ send: true, mobile: '+447400123456' });
    expect(textDecision({ enabled: true, consent, hour: 18, ...window })).toEqual({ send: true, mobile: '+447400123456' });
    expect(textDecision({ enabled: true, consent, hour: 19, ...window })).toMatchObject({ send: false, reason: 'Texts go only between 09:00 and 19:00.' });
    expect(textDecision({ enabled: true, consent, hour: 8, ...window })).toMatchObject({ send: false });
    expect(textDecision({ enabled: true, consent, hour: 2, ...window })).toMatchObject({ send: false });
  });
});

describe('withinSendingHours', () => {
  // [from, until): 09:00 is in, 19:00 is out — the same half-open window the reminder sweep used.
  it.each([
    [8, false], [9, true], [13, true], [18, true], [19, false], [23, false], [0, false],
  ])('hour %i in 09–19 → %s', (hour, expected) => {
    expect(withinSendingHours(hour, 9, 19)).toBe(expected);
  });

  it('a window over midnight (22–06) holds 23 and 05 but not 12', () => {
    expect([23, 5, 12].map((h) => withinSendingHours(h, 22, 6))).toEqual([true, true, false]);
  });
});

describe('isStopReply', () => {
  // Common practice — no published source: STOP and its usual synonyms, any case, as the first word.
  it.each(['STOP', 'stop', ' Stop. ', 'STOP please', 'unsubscribe', 'STOPALL', 'Quit'])('%j stops texts', (text) => {
    expect(isStopReply(text)).toBe(true);
  });
  it.each(['Please don’t stop', 'OK thanks', 'STOPPED', ''])('%j does not', (text) => {
    expect(isStopReply(text)).toBe(false);
  });
});

describe('redactLinks', () => {
  it('keeps the words and replaces a working sign-in link', () => {
    const text = 'Carry on here: http://127.0.0.1:4321/api/auth/callback/nodemailer?callbackUrl=x&token=abc123&email=a%40example.com Reply STOP to stop texts.';
    expect(redactLinks(text)).toBe('Carry on here: [sign-in link] Reply STOP to stop texts.');
    expect(redactLinks(text)).not.toContain('abc123');
  });
});

describe('checkUkMobile against libphonenumber’s full metadata (the reference library)', () => {
  // The prefix rule (from memory of Ofcom's numbering plan) must agree with libphonenumber-js/max,
  // whose getType() classifies each number from the full UK metadata.
  const samples = ['07400 123456', '07911 123456', '07624 123456', '07123 456789', '07500 900999', '07011 123456', '07600 123456', '0113 496 0000', '020 7946 0958', '0800 123 4567'];
  it.each(samples)('%s', (n) => {
    const reference = parsePhoneNumberFromString(n, 'GB');
    const isMobile = Boolean(reference?.isValid() && reference.getType() === 'MOBILE');
    expect(checkUkMobile(n).ok).toBe(isMobile);
  });

  it('gives the E.164 form for storage', () => {
    expect(checkUkMobile('+44 7400 123456')).toEqual({ ok: true, e164: '+447400123456', display: '07400 123456' });
  });
});

describe('textConsentSchema', () => {
  it('needs an explicit true, not a truthy string', () => {
    expect(textConsentSchema.safeParse({ mobile: '07400 123456', agree: 'yes' }).success).toBe(false);
    expect(textConsentSchema.safeParse({ mobile: '07400 123456' }).success).toBe(false);
    expect(textConsentSchema.parse({ mobile: '07400 123456', agree: true })).toEqual({ mobile: '+447400123456', agree: true });
  });
  it('refuses a landline with a plain reason', () => {
    const r = textConsentSchema.safeParse({ mobile: '0113 496 0000', agree: true });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0]?.message).toMatch(/mobile/);
  });
});
