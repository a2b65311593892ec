import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { parsePhoneNumberFromString as parseWithEveryCountry } from 'libphonenumber-js';
import { checkUkPhone } from '@/lib/validation/phone';
import ukMetadata from '@/lib/validation/uk-phone-metadata.json';
import { ukMetadata as cutDown } from '../../scripts/phone-metadata.mjs';

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

describe('the +44 metadata the app ships', () => {
  it('is the current libphonenumber-js metadata for calling code 44 (rerun scripts/phone-metadata.mjs after an upgrade)', () => {
    const require = createRequire(import.meta.url);
    const full = JSON.parse(readFileSync(require.resolve('libphonenumber-js/metadata.min.json'), 'utf8'));
    expect(ukMetadata).toEqual(cutDown(full));
    expect(Object.keys(ukMetadata.countries).sort()).toEqual(['GB', 'GG', 'IM', 'JE']);
  });

  it('reads UK numbers exactly as the library with every country does', () => {
    // The library's own example numbers for the four regions sharing +44 (libphonenumber-js examples.mobile.json).
    const require = createRequire(import.meta.url);
    const examples = JSON.parse(readFileSync(require.resolve('libphonenumber-js/examples.mobile.json'), 'utf8')) as Record<string, string>;
    for (const region of ['GB', 'GG', 'IM', 'JE']) {
      const national = examples[region]!;
      const reference = parseWithEveryCountry(national, region as 'GB')!;
      const ours = checkUkPhone(reference.number);
      expect(ours, region).toEqual({ ok: true, e164: reference.number, display: parseWithEveryCountry(reference.number)!.formatNational() });
    }
  });
});

