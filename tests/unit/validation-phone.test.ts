import { describe, expect, it } from 'vitest';
import { checkUkPhone } from '../../src/lib/validation/phone';

// Source: the UK numbering plan as encoded in libphonenumber-js metadata (ITU-T E.164 output).
// Example numbers are Ofcom's ranges reserved for drama (0113 496 0xxx, 020 7946 0xxx), from
// memory: they are never allocated to a real line.

describe('checkUkPhone', () => {
  it('normalises a national number to E.164 and national display', () => {
    expect(checkUkPhone('0113 496 0000')).toEqual({ ok: true, e164: '+441134960000', display: '0113 496 0000' });
    expect(checkUkPhone('(020) 7946 0958')).toEqual({ ok: true, e164: '+442079460958', display: '020 7946 0958' });
  });

  it('reads the international forms +44, 0044 and +44 (0)', () => {
    for (const input of ['+44 113 496 0000', '0044 113 496 0000', '+44 (0)113 496 0000', '01134960000']) {
      expect(checkUkPhone(input), input).toEqual({ ok: true, e164: '+441134960000', display: '0113 496 0000' });
    }
  });

  it('refuses a number too short to be complete', () => {
    expect(checkUkPhone('0113 496')).toMatchObject({ ok: false });
  });

  it('refuses an unallocated range: Ofcom drama mobiles 07700 900xxx (from memory)', () => {
    // The library treats this reserved range as not a real number, so demo data must use the
    // landline drama ranges above.
    expect(checkUkPhone('07700 900123')).toMatchObject({ ok: false });
  });

  it('refuses a valid number outside the UK with a UK-specific message', () => {
    expect(checkUkPhone('+33 6 12 34 56 78')).toMatchObject({ ok: false, message: expect.stringMatching(/UK phone number/) });
  });

  it('refuses words, empty input, over-long input and extensions', () => {
    expect(checkUkPhone('call me')).toMatchObject({ ok: false });
    expect(checkUkPhone('  ')).toMatchObject({ ok: false, message: 'Please enter a phone number.' });
    expect(checkUkPhone('0'.repeat(41))).toMatchObject({ ok: false });
    expect(checkUkPhone('0113 496 0000 ext. 12')).toMatchObject({ ok: false, message: expect.stringMatching(/extension/) });
  });
});
