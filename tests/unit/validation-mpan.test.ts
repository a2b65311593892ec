import { describe, expect, it } from 'vitest';
import {
  INDEPENDENT_NETWORK,
  UNLISTED_DISTRIBUTOR,
  checkMpanCore,
  mpanCheckDigit,
  mpanRegions,
  normaliseMpanCore,
  regionForDistributor,
} from '@/lib/validation/mpan';

// Source for the rule and the worked example: the MRA/Elexon MPAN definition as described in the
// Wikipedia article "Meter Point Administration Number" — weights 3,5,7,13,17,19,23,29,31,37,41,43
// on the first 12 digits, sum mod 11 mod 10.

describe('mpanCheckDigit', () => {
  it('gives 7 for the published worked example 131234567890(7)', () => {
    // Wikipedia "Meter Point Administration Number" worked example. By hand:
    // 1×3 + 3×5 + 1×7 + 2×13 + 3×17 + 4×19 + 5×23 + 6×29 + 7×31 + 8×37 + 9×41 + 0×43
    // = 3 + 15 + 7 + 26 + 51 + 76 + 115 + 174 + 217 + 296 + 369 + 0 = 1349
    // 1349 mod 11: 11 × 122 = 1342, remainder 7; 7 mod 10 = 7.
    expect(mpanCheckDigit('131234567890')).toBe(7);
  });

  it('gives 0 when the sum mod 11 is 10', () => {
    // Found by hand from the worked example: its sum 1349 ≡ 7 (mod 11). The 12th digit weighs 43,
    // and 43 ≡ −1 (mod 11), so a 12th digit d moves the remainder by −d. To reach 10 we need
    // 7 − d ≡ 10, so d ≡ −3 ≡ 8. Sum = 1349 + 8×43 = 1349 + 344 = 1693;
    // 11 × 153 = 1683, remainder 10; 10 mod 10 = 0.
    expect(mpanCheckDigit('131234567898')).toBe(0);
  });

  it('refuses anything but 12 digits', () => {
    expect(() => mpanCheckDigit('13123456789')).toThrow(RangeError);
    expect(() => mpanCheckDigit('13123456789A')).toThrow(RangeError);
  });
});

describe('checkMpanCore', () => {
  it('accepts the worked example 1312345678907 (the market operator\'s rule: sum 1349 → 7)', () => {
    expect(checkMpanCore('1312345678907')).toEqual({
      ok: true,
      core: '1312345678907',
      distributorId: '13',
      region: 'Merseyside, Cheshire and North Wales',
      distributorStatus: 'region',
    });
  });

  it('accepts the core of the mpan library example 001112221312345678907', () => {
    // limejump/mpan's valid example is a full 21-digit MPAN: top line 00 111 222 (profile class,
    // meter time-switch code, line loss factor class), then the 13-digit core 1312345678907.
    const full = '001112221312345678907';
    expect(checkMpanCore(full.slice(8))).toMatchObject({ ok: true, core: '1312345678907' });
  });

  it('refuses the full 21-digit MPAN with a pointer to the 13-digit core', () => {
    const result = checkMpanCore('001112221312345678907');
    expect(result).toMatchObject({ ok: false, reason: 'length' });
    expect(!result.ok && result.message).toMatch(/13-digit core/);
  });

  it('accepts a core whose check digit is 0 (sum mod 11 = 10)', () => {
    // Working in the mpanCheckDigit test above: sum 1693, 1693 mod 11 = 10, check digit 0.
    expect(checkMpanCore('1312345678980')).toMatchObject({ ok: true, core: '1312345678980' });
  });

  it('refuses a wrong check digit', () => {
    // The worked example's check digit is 7; 6 must fail.
    expect(checkMpanCore('1312345678906')).toMatchObject({ ok: false, reason: 'check-digit' });
  });

  it('accepts spaces and hyphens as printed or copied, and stores digits only', () => {
    expect(checkMpanCore(' 13 1234 5678 907 ')).toMatchObject({ ok: true, core: '1312345678907' });
    expect(checkMpanCore('13-1234-5678-907')).toMatchObject({ ok: true, core: '1312345678907' });
    expect(normaliseMpanCore('13 1234\t5678-907')).toBe('1312345678907');
  });

  it('refuses 12 and 14 digits (a core has 13)', () => {
    expect(checkMpanCore('131234567890')).toMatchObject({ ok: false, reason: 'length' });
    expect(checkMpanCore('13123456789070')).toMatchObject({ ok: false, reason: 'length' });
    expect(checkMpanCore('')).toMatchObject({ ok: false, reason: 'length' });
  });

  it('refuses letters, naming the likely O-for-zero slip', () => {
    const result = checkMpanCore('13123456789O7');
    expect(result).toMatchObject({ ok: false, reason: 'characters' });
    expect(!result.ok && result.message).toMatch(/digits only/);
  });

  it('refuses distributor IDs below 10 as not GB distributors', () => {
    // 00 with the rest of the worked example: 0×3 + 0×5 = 0 instead of 3 + 15, sum 1349 − 18 = 1331
    // = 11 × 121, remainder 0, so 0012345678900 passes the check digit and is refused on the ID.
    expect(mpanCheckDigit('001234567890')).toBe(0);
    expect(checkMpanCore('0012345678900')).toMatchObject({ ok: false, reason: 'distributor' });
    expect(checkMpanCore('0912345678900')).toMatchObject({ ok: false, reason: 'distributor' });
  });

  it('shows Yorkshire for distributor 23', () => {
    // 2312345678900 by hand: 2×3 + 3×5 + 1×7 + 2×13 + 3×17 + 4×19 + 5×23 + 6×29 + 7×31 + 8×37
    // + 9×41 + 0×43 = 6 + 15 + 7 + 26 + 51 + 76 + 115 + 174 + 217 + 296 + 369 = 1352;
    // 1352 − 1342 = 10, so the check digit is 0.
    expect(checkMpanCore('2312345678900')).toEqual({ ok: true, core: '2312345678900', distributorId: '23', region: 'Yorkshire', distributorStatus: 'region' });
  });

  it('shows Eastern England for distributor 10', () => {
    // 1012345678903 by hand: as the worked example but the 2nd digit 0 not 3, so 1349 − 3×5 = 1334;
    // 11 × 121 = 1331, remainder 3.
    expect(checkMpanCore('1012345678903')).toMatchObject({ ok: true, region: 'Eastern England' });
  });

  it('shows "independent network" for a listed independent-network ID (24–37, from memory)', () => {
    // 2412345678904 by hand: 2×3 + 4×5 = 26 in place of 6 + 15 = 21 in the Yorkshire sum, so
    // 1352 + 5 = 1357; 1357 − 1353 (11 × 123) = 4.
    expect(checkMpanCore('2412345678904')).toMatchObject({ ok: true, distributorId: '24', region: INDEPENDENT_NETWORK, distributorStatus: 'independent' });
    expect(regionForDistributor('37')).toBe(INDEPENDENT_NETWORK);
  });

  it('accepts an unlisted ID from 24 up when the check digit adds up, but marks it unlisted', () => {
    // 9912345678906: 9×3 + 9×5 = 72 in place of 21 → 1352 − 21 + 72 = 1403; 1403 − 1397 (11 × 127) = 6.
    expect(checkMpanCore('9912345678906')).toMatchObject({ ok: true, distributorId: '99', distributorStatus: 'unlisted', region: UNLISTED_DISTRIBUTOR });
    // 3812345678905: 3×3 + 8×5 = 49 → 1352 − 21 + 49 = 1380; 1380 − 1375 (11 × 125) = 5.
    expect(checkMpanCore('3812345678905')).toMatchObject({ ok: true, distributorStatus: 'unlisted' });
    expect(regionForDistributor('99')).toBe(UNLISTED_DISTRIBUTOR);
  });
});

describe('mpanRegions', () => {
  it('lists the 14 GB regions for distributor IDs 10–23, by region name', () => {
    // TRADE-REFERENCE.md, "Supply identity" (Elexon distributor IDs 10–23).
    expect(mpanRegions).toEqual({
      '10': 'Eastern England',
      '11': 'East Midlands',
      '12': 'London',
      '13': 'Merseyside, Cheshire and North Wales',
      '14': 'West Midlands',
      '15': 'North East England',
      '16': 'North West England',
      '17': 'North Scotland',
      '18': 'South Scotland',
      '19': 'South East England',
      '20': 'Southern England',
      '21': 'South Wales',
      '22': 'South West England',
      '23': 'Yorkshire',
    });
  });

  it('gives no region for IDs below 10', () => {
    expect(regionForDistributor('09')).toBeNull();
    expect(regionForDistributor('1')).toBeNull();
  });
});
