import { describe, expect, it } from 'vitest';
import { VIN_CHECK_DIGIT_WARNING, checkVin, normaliseVin, vinCheckDigit } from '@/lib/validation/vin';

// Source: 49 CFR Part 565, §565.15 — transliteration A=1…H=8, J=1…R=9 (P=7), S=2…Z=9; weights
// 8,7,6,5,4,3,2,10,0,9,8,7,6,5,4,3,2; sum mod 11, 10 written "X". No I, O or Q in a VIN.

describe('vinCheckDigit', () => {
  it('gives X for the worked example 1M8GDM9AXKP042788', () => {
    // By hand: 1×8 + M(4)×7 + 8×6 + G(7)×5 + D(4)×4 + M(4)×3 + 9×2 + A(1)×10 + X×0 + K(2)×9
    // + P(7)×8 + 0×7 + 4×6 + 2×5 + 7×4 + 8×3 + 8×2
    // = 8 + 28 + 48 + 35 + 16 + 12 + 18 + 10 + 0 + 18 + 56 + 0 + 24 + 10 + 28 + 24 + 16 = 351;
    // 351 mod 11: 11 × 31 = 341, remainder 10 → "X".
    expect(vinCheckDigit('1M8GDM9AXKP042788')).toBe('X');
  });

  it('gives a digit when the remainder is below 10', () => {
    // Last character 8 → 9 adds 1 × 2 (weight 2): 351 + 2 = 353; 353 − 341 = 12; 12 − 11 = 1.
    expect(vinCheckDigit('1M8GDM9A1KP042789')).toBe('1');
  });
});

describe('checkVin', () => {
  it('accepts the §565.15 worked example without a warning', () => {
    expect(checkVin('1M8GDM9AXKP042788')).toEqual({ ok: true, vin: '1M8GDM9AXKP042788' });
    expect(checkVin('1M8GDM9A1KP042789')).toEqual({ ok: true, vin: '1M8GDM9A1KP042789' });
  });

  it('normalises case and spaces', () => {
    expect(normaliseVin(' 1m8 gdm9ax kp042788 ')).toBe('1M8GDM9AXKP042788');
    expect(checkVin(' 1m8 gdm9ax kp042788 ')).toEqual({ ok: true, vin: '1M8GDM9AXKP042788' });
  });

  it('accepts a position-9 mismatch with a warning, as a European VIN need not carry the check digit', () => {
    // Position 9 changed from X to 1; the computed check character is still X (sum 351).
    expect(checkVin('1M8GDM9A1KP042788')).toEqual({ ok: true, vin: '1M8GDM9A1KP042788', warning: VIN_CHECK_DIGIT_WARNING });
  });

  it('refuses I, O and Q and names the letter found', () => {
    for (const [vin, letter] of [
      ['1M8GDM9AXKP0427O8', 'O'],
      ['1M8GDM9AXKI042788', 'I'],
      ['1M8GDM9AXKQ042788', 'Q'],
    ] as const) {
      const result = checkVin(vin);
      expect(result.ok).toBe(false);
      expect(!result.ok && result.message).toContain(`has ${letter}`);
    }
  });

  it('refuses a wrong length', () => {
    expect(checkVin('1M8GDM9AXKP04278')).toMatchObject({ ok: false, message: expect.stringContaining('this has 16') });
    expect(checkVin('1M8GDM9AXKP0427888')).toMatchObject({ ok: false, message: expect.stringContaining('this has 18') });
    expect(checkVin('')).toMatchObject({ ok: false });
  });

  it('refuses punctuation', () => {
    expect(checkVin('1M8GDM9A-XKP04278')).toMatchObject({ ok: false, message: expect.stringContaining('letters and numbers only') });
  });
});
