import { describe, expect, it } from 'vitest';
import { checkNetworkOperator } from '../../src/lib/readiness/checks/network-operator';
import { decideNetworkRoute } from '../../src/lib/readiness/network-route';
import { resolveReadinessSettings } from '../../src/lib/readiness/settings';
import type { FuseRating, LoadAnswers, Looped, ReadinessSettingsInput } from '../../src/lib/readiness';

// Energy Networks Association, "Connecting electric vehicles and heat pumps": install and notify
// within 28 days when every notification criterion is met; apply before connecting when the new
// maximum demand exceeds the cut-out rating or 60 A (13.8 kVA single phase), the supply is
// looped, or the cut-out is unknown. Demand as in supply-headroom: 10 A baseline (common
// practice) + Table A2 diversity + 32 A charger (BS 7671 722.311).

interface Case {
  fuse: FuseRating | null;
  looped: Looped | null;
  loads: LoadAnswers | null;
  settings?: ReadinessSettingsInput;
}

function decide({ fuse, looped, loads, settings = {} }: Case) {
  return decideNetworkRoute({ supply: { mainFuseAmps: fuse, looped, loads } }, resolveReadinessSettings(settings));
}

function check({ fuse, looped, loads, settings = {} }: Case, mpanCore: string | null = null) {
  return checkNetworkOperator({
    answers: { supply: { mainFuseAmps: fuse, looped, loads, mpanCore } },
    uploads: [],
    settings: resolveReadinessSettings(settings),
    today: '2025-03-03',
  });
}

describe('the ENA route for each criterion', () => {
  it.each([
    // 10 + 32 = 42 A ≤ 60 A and ≤ 100 A, not looped, cut-out known → notify after.
    { name: 'all criteria met', c: { fuse: 100, looped: 'no', loads: {} }, route: 'notify-after', reasons: [] },
    // 10 + 45.65 + 32 = 87.65 A > 60 A → apply before (within the 100 A cut-out).
    { name: 'demand over 60 A', c: { fuse: 100, looped: 'no', loads: { showerKw: 10.5 } }, route: 'apply-before', reasons: ['demand-over-limit'] },
    // 87.65 A > 60 A cut-out and > 60 A limit → both reasons.
    { name: 'demand over cut-out and limit', c: { fuse: 60, looped: 'no', loads: { showerKw: 10.5 } }, route: 'apply-before', reasons: ['demand-over-cutout', 'demand-over-limit'] },
    // With the limit raised to 100 A in settings, 87.65 A on a 60 A cut-out trips only the cut-out criterion.
    { name: 'demand over cut-out only', c: { fuse: 60, looped: 'no', loads: { showerKw: 10.5 }, settings: { enaDemandLimitAmps: 100 } }, route: 'apply-before', reasons: ['demand-over-cutout'] },
    // Looped supply → apply before, whatever the demand.
    { name: 'looped', c: { fuse: 100, looped: 'yes', loads: {} }, route: 'apply-before', reasons: ['looped-supply'] },
    // Looped not known → treated as possibly looped until settled.
    { name: 'looped unsure', c: { fuse: 100, looped: 'unsure', loads: {} }, route: 'apply-before', reasons: ['looped-unknown'] },
    { name: 'looped unanswered', c: { fuse: 100, looped: null, loads: {} }, route: 'apply-before', reasons: ['looped-unknown'] },
    // Cut-out rating unknown → apply before.
    { name: 'cut-out unknown', c: { fuse: null, looped: 'no', loads: {} }, route: 'apply-before', reasons: ['cutout-unknown'] },
  ] as const)('$name → $route $reasons', ({ c, route, reasons }) => {
    const decision = decide(c);
    expect(decision.route).toBe(route);
    expect(decision.reasons.map((r) => r.code)).toEqual(reasons);
  });

  it.each([
    // Baseline 28 A: 28 + 32 = 60 A, not over 60 A → notify after.
    { baselineAmps: 28, route: 'notify-after' },
    // Baseline 28.01 A: 60.01 A > 60 A → apply before.
    { baselineAmps: 28.01, route: 'apply-before' },
  ] as const)('60 A edge: baseline $baselineAmps A → $route', ({ baselineAmps, route }) => {
    expect(decide({ fuse: 100, looped: 'no', loads: {}, settings: { baselineAmps } }).route).toBe(route);
  });
});

describe('network-operator light and figures', () => {
  it('is green for a settled notify-after, with 28 days to notify and no lead time', () => {
    const result = check({ fuse: 100, looped: 'no', loads: {} });
    expect(result.light).toBe('green');
    expect(result.figures).toMatchObject({ route: 'notify-after', leadTimeDays: 0, notifyWithinDays: 28, settled: true });
    expect(result.actions).toEqual([]);
  });

  it('is amber for apply-before, carrying the supply-upgrade lead time from settings', () => {
    const result = check({ fuse: 100, looped: 'no', loads: { showerKw: 10.5 } });
    expect(result.light).toBe('amber');
    expect(result.figures).toMatchObject({ route: 'apply-before', leadTimeDays: 28 });
    expect(result.staffText).toMatch(/87\.65 A exceeds 60 A \(13\.8 kVA single phase\)/);
    expect(check({ fuse: 100, looped: 'yes', loads: {}, settings: { supplyUpgradeLeadDays: 10 } }).figures.leadTimeDays).toBe(10);
  });

  it('is amber while loads are not declared, even when the route looks like notify-after', () => {
    const result = check({ fuse: 100, looped: 'no', loads: null });
    expect(result.figures.route).toBe('notify-after');
    expect(result.figures.settled).toBe(false);
    expect(result.light).toBe('amber');
  });

  it('is amber, not red, for an unknown cut-out or looped supply', () => {
    expect(check({ fuse: null, looped: 'unsure', loads: {} }).light).toBe('amber');
  });

  it('names the distribution region from a valid MPAN core', () => {
    // 1312345678907: the worked example, distributor 13.
    expect(check({ fuse: 100, looped: 'no', loads: {} }, '1312345678907').figures.region).toBe('Merseyside, Cheshire and North Wales');
    expect(check({ fuse: 100, looped: 'no', loads: {} }, '1312345678901').figures.region).toBeNull();
  });

  it('says "until we know more" when only unknowns point to applying first', () => {
    expect(check({ fuse: null, looped: 'no', loads: {} }).customerText).toMatch(/^Until we know a little more/);
    expect(check({ fuse: 100, looped: 'yes', loads: {} }).customerText).toMatch(/^Before the charger is connected/);
  });
});
