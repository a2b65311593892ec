// UK phone numbers: pure and client-safe, using libphonenumber-js's core with its own metadata
// cut to calling code +44 (scripts/phone-metadata.mjs): 4 KB instead of every country's 80 KB,
// which the checklist would otherwise download on a phone. A number from elsewhere does not parse.
import { parsePhoneNumberFromString } from 'libphonenumber-js/core';
import metadata from './uk-phone-metadata.json';

export type PhoneResult = { ok: true; e164: string; display: string } | { ok: false; message: string };

// Longer input is not a phone number, and capping it bounds the parser's work.
const MAX_INPUT = 40;

/**
 * Checks a UK phone number (country code 44, which the Crown Dependencies share) and returns
 * it in E.164 for storage and in the national style for display.
 *
 * @example checkUkPhone('0113 496 0000') // { ok: true, e164: '+441134960000', display: '0113 496 0000' }
 */
export function checkUkPhone(input: string): PhoneResult {
  const trimmed = input.trim();
  if (trimmed.length === 0) return { ok: false, message: 'Please enter a phone number.' };
  if (trimmed.length > MAX_INPUT) return { ok: false, message: 'This is too long for a phone number. Please check it.' };
  const parsed = parsePhoneNumberFromString(trimmed, 'GB', metadata as Parameters<typeof parsePhoneNumberFromString>[2]);
  if (!parsed || !parsed.isValid()) {
    return { ok: false, message: 'This does not look like a UK phone number. Please check it, including the area code.' };
  }
  if (parsed.countryCallingCode !== '44') {
    return { ok: false, message: 'Please give a UK phone number, starting 0 or +44.' };
  }
  if (parsed.ext) return { ok: false, message: 'Please leave out the extension and give a number that reaches you directly.' };
  return { ok: true, e164: parsed.number, display: parsed.formatNational() };
}

/**
 * Checks a UK mobile number, for text messages: a valid UK number (checkUkPhone) in the 07 mobile
 * range. From memory of Ofcom's National Telephone Numbering Plan: 071–075 and 077–079 are
 * mobiles, 070 is personal numbering and 076 radiopaging, except 07624 (Isle of Man mobiles).
 * The prefix rule keeps the browser bundle on the small metadata; the tests check it against
 * libphonenumber's full metadata.
 *
 * @example checkUkMobile('07400 123456') // { ok: true, e164: '+447400123456', display: '07400 123456' }
 */
export function checkUkMobile(input: string): PhoneResult {
  const result = checkUkPhone(input);
  if (!result.ok) return result;
  const mobile = /^\+447[1-57-9]/.test(result.e164) || result.e164.startsWith('+447624');
  if (!mobile) return { ok: false, message: 'Texts need a mobile number: a UK mobile starts 07 (or +44 7).' };
  return result;
}
