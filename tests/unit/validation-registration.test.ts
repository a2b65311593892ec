import { describe, expect, it } from 'vitest';
import { ageIdentifierStart, checkRegistration } from '@/lib/validation/registration';

// Source: DVLA INF104 (as summarised in TRADE-REFERENCE.md, "Vehicle"). Current format since
// September 2001: two letters, two-digit age identifier (March = the year's last two digits,
// September = year + 50), a space, three letters. Suffix ABC 123A (1963–82), prefix A123 ABC
// (1983–2001), dateless marks, and Northern Ireland's own system. All marks here are invented.

const TODAY = new Date('2026-12-01T12:00:00Z');

describe('current format (INF104, since September 2001)', () => {
  it('normalises to upper case with one space and reads a March age identifier', () => {
    // 12 = March 2012 (the year's last two digits).
    expect(checkRegistration('ab12cde', TODAY)).toEqual({ ok: true, registration: 'AB12 CDE', format: 'current' });
    expect(checkRegistration('  Ab 12  cDe ', TODAY)).toEqual({ ok: true, registration: 'AB12 CDE', format: 'current' });
    expect(ageIdentifierStart('12')).toBe(Date.UTC(2012, 2, 1));
  });

  it('reads a September age identifier', () => {
    // 62 = September 2012 (2012 + 50).
    expect(checkRegistration('AB62 CDE', TODAY)).toEqual({ ok: true, registration: 'AB62 CDE', format: 'current' });
    expect(ageIdentifierStart('62')).toBe(Date.UTC(2012, 8, 1));
  });

  it('accepts the first code, 51 (September 2001), and the first March code, 02 (March 2002)', () => {
    expect(checkRegistration('AB51 CDE', TODAY)).toEqual({ ok: true, registration: 'AB51 CDE', format: 'current' });
    expect(checkRegistration('AB02 CDE', TODAY)).toEqual({ ok: true, registration: 'AB02 CDE', format: 'current' });
  });

  it('warns on 01, which would be March 2001, before the format began', () => {
    const result = checkRegistration('AB01 CDE', TODAY);
    expect(result).toMatchObject({ ok: true, registration: 'AB01 CDE', format: 'current' });
    expect(result.ok && result.warning).toMatch(/never issued/);
  });

  it('accepts the latest issued code and warns on one not yet issued', () => {
    // On 1 December 2026 the latest code is 76 (September 2026 = 2026 + 50); 27 (March 2027) is not out.
    expect(checkRegistration('AB76 CDE', TODAY)).toEqual({ ok: true, registration: 'AB76 CDE', format: 'current' });
    expect(checkRegistration('AB27 CDE', TODAY)).toMatchObject({ ok: true, warning: expect.stringMatching(/not in use yet/) });
    // The day before September 2026's plates, 76 is not yet out either.
    expect(checkRegistration('AB76 CDE', new Date('2026-08-31T12:00:00Z'))).toMatchObject({ warning: expect.any(String) });
  });

  // Letter rules by position, from memory (not in the trade reference): the memory tag (first
  // two letters) never uses I, Q or Z; the three random letters never use I or Q, but do use Z.
  it.each([
    { mark: 'AB12 CDI', warns: /last three letters .* never include I/ },
    { mark: 'AB12 QDE', warns: /last three letters .* never include Q/ },
    { mark: 'QB12 CDE', warns: /first two letters .* never include Q/ },
    { mark: 'AZ12 CDE', warns: /first two letters .* never include Z/ },
    { mark: 'IB12 CDE', warns: /first two letters .* never include I/ },
  ])('warns on $mark (from memory)', ({ mark, warns }) => {
    expect(checkRegistration(mark, TODAY)).toMatchObject({ ok: true, format: 'current', warning: expect.stringMatching(warns) });
  });

  it('does not warn on Z among the random letters (from memory: it is used there)', () => {
    expect(checkRegistration('AB12 CDZ', TODAY)).toEqual({ ok: true, registration: 'AB12 CDZ', format: 'current' });
  });

  it.each([
    // Year letters skipped I, O, U and Z (and Q for suffixes) — from memory. A prefix Q marks a
    // vehicle of unknown age, so it is not warned.
    { mark: 'ABC 123I', format: 'suffix', warns: true },
    { mark: 'ABC 123Q', format: 'suffix', warns: true },
    { mark: 'ABC 123A', format: 'suffix', warns: false },
    { mark: 'U123 ABC', format: 'prefix', warns: true },
    { mark: 'Z123 ABC', format: 'prefix', warns: true },
    { mark: 'Q123 ABC', format: 'prefix', warns: false },
  ])('year letter in $mark: warns $warns (from memory)', ({ mark, format, warns }) => {
    const result = checkRegistration(mark, TODAY);
    expect(result).toMatchObject({ ok: true, format });
    expect(result.ok && Boolean(result.warning)).toBe(warns);
  });
});

describe('older GB formats (INF104)', () => {
  it('suffix: ABC 123A', () => {
    expect(checkRegistration('abc123a', TODAY)).toEqual({ ok: true, registration: 'ABC 123A', format: 'suffix' });
    expect(checkRegistration('ABC 1A', TODAY)).toEqual({ ok: true, registration: 'ABC 1A', format: 'suffix' });
  });

  it('prefix: A123 ABC', () => {
    expect(checkRegistration('a123abc', TODAY)).toEqual({ ok: true, registration: 'A123 ABC', format: 'prefix' });
    expect(checkRegistration('A 1 ABC', TODAY)).toEqual({ ok: true, registration: 'A1 ABC', format: 'prefix' });
  });

  it('dateless: letters then digits, or digits then letters (shape from memory)', () => {
    expect(checkRegistration('abc 1234', TODAY)).toEqual({ ok: true, registration: 'ABC 1234', format: 'dateless' });
    expect(checkRegistration('1234ab', TODAY)).toEqual({ ok: true, registration: '1234 AB', format: 'dateless' });
    expect(checkRegistration('A 1', TODAY)).toEqual({ ok: true, registration: 'A 1', format: 'dateless' });
  });
});

describe('Northern Ireland (rule from memory: last two letters hold I or Z)', () => {
  it('recognises a mark such as ABZ 1234', () => {
    expect(checkRegistration('abz1234', TODAY)).toEqual({ ok: true, registration: 'ABZ 1234', format: 'northern-ireland' });
    expect(checkRegistration('AIB 12', TODAY)).toEqual({ ok: true, registration: 'AIB 12', format: 'northern-ireland' });
  });

  it('leaves letters-then-digits without I or Z in the last two letters as dateless GB', () => {
    // Z as the first of three letters is outside the two-letter code the rule looks at.
    expect(checkRegistration('ZAB 12', TODAY)).toMatchObject({ format: 'dateless' });
  });
});

describe('unusual and impossible marks', () => {
  it('keeps an unusual but possible mark with a warning', () => {
    const result = checkRegistration('a1b 2c3', TODAY);
    expect(result).toMatchObject({ ok: true, registration: 'A1B 2C3', format: 'unknown' });
    expect(result.ok && result.warning).toMatch(/usual GB number plate formats/);
  });

  it('refuses punctuation and other characters no plate carries', () => {
    for (const mark of ['AB12-CDE', 'AB12.CDE', 'AB12_CDE', 'ÄB12 CDE', 'AB12 CDE!']) {
      expect(checkRegistration(mark, TODAY), mark).toMatchObject({ ok: false, message: expect.stringMatching(/only letters and numbers/) });
    }
  });

  it('refuses more than seven characters, the longest any listed format reaches', () => {
    expect(checkRegistration('AB12 CDEF', TODAY)).toMatchObject({ ok: false, message: expect.stringContaining('this has 8') });
  });

  it('refuses an empty entry', () => {
    expect(checkRegistration('   ', TODAY)).toMatchObject({ ok: false });
  });
});
