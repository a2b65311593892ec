import { describe, expect, it } from 'vitest';
import { checkNetworkOperator } from '@/lib/readiness/checks/network-operator';
import { decideNetworkRoute } from '@/lib/readiness/network-route';
import { resolveReadinessSettings } from '@/lib/readiness/settings';
import type { ChecklistAnswers, FuseRating, LoadAnswers, Looped, ReadinessSettingsInput, SiteMeasures, SupplyPhases } from '@/lib/readiness';

// Energy Networks Association, "Connecting electric vehicles and heat pumps" and its application
// form: where every notification criterion is met, install and notify within 28 days ("Connect &
// Notify", as the ENA's FAQ on connecting EVs and heat pumps writes it); otherwise apply first
// ("Apply to Connect", beside it in NIE Networks' LCT process page, maintained by the ENA's LCT group):
// new maximum demand over the cut-out rating or over 60 A (13.8 kVA single phase), a looped
// supply, an unknown cut-out. Per phase on three phases, and charge points above 32 A per phase
// apply first (from memory).
// Demand as in supply-headroom (IET On-Site Guide Table A2, second-hand via The Electrician's
// Guide Table 6.2; charger at full load, BS 7671 722.311):
//   one 32 A socket circuit 32 A + lighting 0.66 × 2000 / 230 = 5.739 A + a 3.6 kW (16 A) charger = 53.739 A
//   two socket circuits 44.8 A + 5.739 A + a 7.4 kW (32 A) charger = 82.539 A

const declared: LoadAnswers = { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 1 };

interface Case {
  fuse: FuseRating | null;
  looped: Looped | null;
  loads: LoadAnswers | null;
  ratingKw?: number;
  phases?: SupplyPhases;
  site?: SiteMeasures;
  settings?: ReadinessSettingsInput;
}

function answersOf({ fuse, looped, loads, ratingKw = 3.6, phases }: Case, mpanCore: string | null = null): ChecklistAnswers {
  return { supply: { mainFuseAmps: fuse, looped, loads, mpanCore, ...(phases ? { phases } : {}) }, charger: { ratingKw } };
}

const decide = (c: Case) => decideNetworkRoute(answersOf(c), c.site ?? {}, resolveReadinessSettings(c.settings ?? {}));
const check = (c: Case, mpanCore: string | null = null) =>
  checkNetworkOperator({ answers: answersOf(c, mpanCore), uploads: [], site: c.site ?? {}, settings: resolveReadinessSettings(c.settings ?? {}), today: '2025-03-03' });

describe('the ENA route for each criterion', () => {
  it.each([
    // 53.739 A ≤ 60 A and ≤ 100 A, not looped, cut-out known → connect and notify.
    { name: 'all criteria met', c: { fuse: 100, looped: 'no', loads: declared }, route: 'notify-after', reasons: [] },
    // Two socket circuits and 7.4 kW: 82.539 A > 60 A → apply first (within the 100 A cut-out).
    { name: 'demand over 60 A', c: { fuse: 100, looped: 'no', loads: { ...declared, socketCircuits: 2 }, ratingKw: 7.4 }, route: 'apply-before', reasons: ['demand-over-limit'] },
    // 82.539 A > 80 A cut-out and > 60 A → both.
    { name: 'demand over cut-out and limit', c: { fuse: 80, looped: 'no', loads: { ...declared, socketCircuits: 2 }, ratingKw: 7.4 }, route: 'apply-before', reasons: ['demand-over-cutout', 'demand-over-limit'] },
    { name: 'looped', c: { fuse: 100, looped: 'yes', loads: declared }, route: 'apply-before', reasons: ['looped-supply'] },
    { name: 'looped unsure', c: { fuse: 100, looped: 'unsure', loads: declared }, route: 'apply-before', reasons: ['looped-unknown'] },
    { name: 'cut-out unknown', c: { fuse: null, looped: 'no', loads: declared }, route: 'apply-before', reasons: ['cutout-unknown'] },
    // Socket circuits not sure: 2 assumed → 32 + 12.8 + 5.739 + 16 = 66.54 A > 60 A, but the least
    // (one circuit, 53.74 A) is under: a possible reason, not a known one.
    { name: 'estimate not firm', c: { fuse: 100, looped: 'no', loads: { ...declared, socketCircuits: 'unsure' } }, route: 'apply-before', reasons: ['demand-may-exceed'] },
    // Three phase, 22 kW: one socket circuit 32 → L1, lighting → L2; + 32 each → 64 A on L1 > 60 A per phase.
    { name: 'three phase over 60 A a phase', c: { fuse: 100, looped: 'no', loads: declared, ratingKw: 22, phases: 'three' }, route: 'apply-before', reasons: ['demand-over-limit'] },
    // Three phase, 11 kW: 32 + 16 = 48 A on the busiest phase ≤ 60 A → connect and notify.
    { name: 'three phase 11 kW within limits', c: { fuse: 100, looped: 'no', loads: declared, ratingKw: 11, phases: 'three' }, route: 'notify-after', reasons: [] },
  ] as const)('$name → $route $reasons', ({ c, route, reasons }) => {
    const decision = decide(c as Case);
    expect(decision.route).toBe(route);
    expect(decision.reasons.map((r) => r.code)).toEqual(reasons);
  });

  it.each([
    // Measured 28 A + 32 A = 60 A, not over 60 A → notify; 28.01 A → 60.01 A → apply.
    { measured: 28, route: 'notify-after' },
    { measured: 28.01, route: 'apply-before' },
  ] as const)('60 A edge with a measured demand of $measured A → $route', ({ measured, route }) => {
    expect(decide({ fuse: 100, looped: 'no', loads: null, ratingKw: 7.4, site: { measuredMaxDemandAmps: measured } }).route).toBe(route);
  });
});

describe('network-operator light and figures', () => {
  it('is green for a settled connect-and-notify, with 28 days to notify and no lead time', () => {
    const result = check({ fuse: 100, looped: 'no', loads: declared });
    expect(result.light).toBe('green');
    expect(result.figures).toMatchObject({ route: 'notify-after', routeName: 'Connect & Notify', leadTimeDays: 0, notifyWithinDays: 28, settled: true });
  });

  it('is amber for apply to connect, carrying the lead time from settings', () => {
    const result = check({ fuse: 100, looped: 'no', loads: { ...declared, socketCircuits: 2 }, ratingKw: 7.4 });
    expect(result.light).toBe('amber');
    expect(result.figures).toMatchObject({ route: 'apply-before', routeName: 'Apply to Connect', leadTimeDays: 28, applyBeforeKnown: true });
    expect(result.staffText).toMatch(/82\.54 A exceeds 60 A \(13\.8 kVA single phase\)/);
  });

  it('a half-answered loads question is not settled: amber, never green', () => {
    const result = check({ fuse: 100, looped: 'no', loads: { cooker: false } });
    expect(result.figures.settled).toBe(false);
    expect(result.light).toBe('amber');
  });

  it('is amber, not red, for an unknown cut-out or looped supply', () => {
    expect(check({ fuse: null, looped: 'unsure', loads: declared }).light).toBe('amber');
    expect(check({ fuse: null, looped: 'unsure', loads: declared }).figures.applyBeforeKnown).toBe(false);
  });

  it('names the distribution region from a valid MPAN core', () => {
    // 1312345678907: the worked example, distributor 13.
    expect(check({ fuse: 100, looped: 'no', loads: declared }, '1312345678907').figures.region).toBe('Merseyside, Cheshire and North Wales');
    expect(check({ fuse: 100, looped: 'no', loads: declared }, '1312345678901').figures.region).toBeNull();
  });

  it('says "until we know more" when only unknowns point to applying first', () => {
    expect(check({ fuse: null, looped: 'no', loads: declared }).customerText).toMatch(/^Until we know a little more/);
    expect(check({ fuse: 100, looped: 'yes', loads: declared }).customerText).toMatch(/^Before the charge point is connected/);
  });
});
