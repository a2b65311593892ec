import { describe, expect, it } from 'vitest';
import { checkSupplyIdentity } from '@/lib/readiness/checks/supply-identity';
import { defaultReadinessSettings } from '@/lib/readiness/settings';

// MPAN core check digit (MRA/Elexon definition as described in the Wikipedia article "Meter
// Point Administration Number"): first 12 digits × 3, 5, 7, 13, 17, 19, 23, 29, 31, 37, 41, 43;
// sum mod 11 mod 10. Distributor IDs 10–23 are regions; the independent-network IDs the market
// operator lists (24–37 here, from memory) show as "independent network"; any other ID from 24
// up is unlisted: amber for the office to confirm.

function identity(mpanCore: string | null) {
  return checkSupplyIdentity({ answers: { supply: { mpanCore } }, uploads: [], site: {}, settings: defaultReadinessSettings, today: '2025-03-03' });
}

describe('unlisted distributor IDs', () => {
  it('9912345678906 adds up (1403 mod 11 = 6) but 99 is not a listed ID → amber, no region', () => {
    const result = identity('9912345678906');
    expect(result.light).toBe('amber');
    expect(result.figures).toMatchObject({ valid: true, distributorId: '99', distributorStatus: 'unlisted', region: null });
    expect(result.customerText).not.toMatch(/distributor/);
  });

  it('2412345678904 (1357 mod 11 = 4): listed independent network → green', () => {
    expect(identity('2412345678904')).toMatchObject({ light: 'green', figures: { region: 'independent network' } });
  });
});

describe('supply-identity', () => {
  it.each([
    // Worked example: sum 1349, 1349 mod 11 = 7 → check digit 7.
    { core: '1312345678907', light: 'green', region: 'Merseyside, Cheshire and North Wales' },
    // Spaces as copied from a bill are ignored.
    { core: '13 1234 5678 907', light: 'green', region: 'Merseyside, Cheshire and North Wales' },
    // 231234567890: 2×3 + 3×5 + 1×7 + 2×13 + 3×17 + 4×19 + 5×23 + 6×29 + 7×31 + 8×37 + 9×41 + 0×43
    // = 6 + 15 + 7 + 26 + 51 + 76 + 115 + 174 + 217 + 296 + 369 + 0 = 1352; 1352 mod 11 = 10 → 0.
    { core: '2312345678900', light: 'green', region: 'Yorkshire' },
    // 241234567890: 6 + 20 + 7 + 26 + 51 + 76 + 115 + 174 + 217 + 296 + 369 + 0 = 1357;
    // 1357 mod 11 = 4 → check digit 4; distributor 24 → independent network.
    { core: '2412345678904', light: 'green', region: 'independent network' },
    // Wrong check digit (1 instead of 7) → red.
    { core: '1312345678901', light: 'red', region: null },
    // 12 digits → red.
    { core: '131234567890', light: 'red', region: null },
    // Missing → amber.
    { core: '', light: 'amber', region: null },
    { core: null, light: 'amber', region: null },
  ])('$core → $light ($region)', ({ core, light, region }) => {
    const result = identity(core);
    expect(result.light).toBe(light);
    expect(result.figures.region).toBe(region);
  });

  it('shows the region back to the customer and explains a refusal', () => {
    expect(identity('2312345678900').customerText).toContain('Yorkshire distribution region');
    expect(identity('2412345678904').customerText).toContain('independent network');
    expect(identity('1312345678901').customerText).toMatch(/mistyped/);
    expect(identity('1312345678901').actions.length).toBe(1);
  });
});
