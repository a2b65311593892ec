import { describe, expect, it } from 'vitest';
import { checkPostcode, normalisePostcode } from '@/lib/validation/postcode';

// Source: BS 7666 / GovTalk PostCodeType (TRADE-REFERENCE.md, "Address"): outward code A9, A99,
// A9A, AA9, AA99 or AA9A; a space; inward code digit + two letters. First letter never Q, V, X;
// second never I, J, Z; inward letters never C, I, K, M, O, V; GIR 0AA is the special case.
// The codes below are built from the pattern, not taken from real addresses.

describe('checkPostcode: each outward pattern', () => {
  it.each([
    ['A9', 'b1 2de', 'B1 2DE'],
    ['A99', 'b12 3de', 'B12 3DE'],
    ['A9A', 'w1b 2de', 'W1B 2DE'],
    ['AA9', 'ab1 2de', 'AB1 2DE'],
    ['AA99', 'ab12 3de', 'AB12 3DE'],
    ['AA9A', 'ab1c 2de', 'AB1C 2DE'],
  ])('%s: %s → %s', (_pattern, input, expected) => {
    expect(checkPostcode(input)).toEqual({ ok: true, postcode: expected });
  });

  it('accepts GIR 0AA, the one special case', () => {
    expect(checkPostcode('GIR 0AA')).toEqual({ ok: true, postcode: 'GIR 0AA' });
    expect(checkPostcode('gir0aa')).toEqual({ ok: true, postcode: 'GIR 0AA' });
  });
});

describe('checkPostcode: normalisation', () => {
  it('accepts a missing space and stray spaces', () => {
    expect(normalisePostcode('ab123de')).toBe('AB12 3DE');
    expect(checkPostcode('  ab12   3de ')).toEqual({ ok: true, postcode: 'AB12 3DE' });
    expect(checkPostcode('A B 1 2 3 D E')).toEqual({ ok: true, postcode: 'AB12 3DE' });
  });
});

describe('checkPostcode: refusals', () => {
  it.each(['Q', 'V', 'X'])('first letter %s is refused', (letter) => {
    expect(checkPostcode(`${letter}1 2DE`).ok).toBe(false);
    expect(checkPostcode(`${letter}B1 2DE`).ok).toBe(false);
  });

  it.each(['I', 'J', 'Z'])('second letter %s is refused', (letter) => {
    expect(checkPostcode(`A${letter}1 2DE`).ok).toBe(false);
  });

  it.each(['C', 'I', 'K', 'M', 'O', 'V'])('inward letter %s is refused in either place', (letter) => {
    expect(checkPostcode(`AB1 2${letter}E`).ok).toBe(false);
    expect(checkPostcode(`AB1 2D${letter}`).ok).toBe(false);
  });

  it('refuses shapes outside the six outward patterns', () => {
    for (const code of ['AB123 4DE', '1AB 2DE', 'ABC1 2DE', 'AB1 23D', 'AB1 2D', 'AB12', '']) {
      expect(checkPostcode(code).ok, code).toBe(false);
    }
  });

  it('gives a plain message', () => {
    expect(checkPostcode('QB1 2DE')).toMatchObject({ ok: false, message: expect.stringMatching(/UK postcode/) });
  });
});
