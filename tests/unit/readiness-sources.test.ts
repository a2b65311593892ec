import { describe, expect, it } from 'vitest';
import {
  runChecks,
  settingDescriptions,
  type CheckResult,
  type ChecklistAnswers,
  type SiteMeasures,
  type UploadSummary,
} from '@/lib/readiness';
import { networkRouteNames } from '@/lib/readiness/network-route';
import { packCautions } from '@/lib/cautions';
import { chandlersChecklist, forgeChecklist, heronChecklist } from '../../seeds/demo-checklists';

// Staff read every check's title, staff text, figures, actions and source, the settings page's
// sources and the pack's cautions. Each must cite a published document a reader can follow —
// BS 7671 (regulation and table numbers), the IET On-Site Guide table, the ENA's guidance for
// connecting charge points, the market operator's MPAN definition, the ESQC Regulations, an IEC
// standard — or say "Common practice — no published source". Never the project's own notes, an
// online encyclopedia, or a "from memory" remark: those belong in code comments and tests.
const FORBIDDEN: readonly RegExp[] = [
  /from memory/i,
  /not seen in the (source|form|published)/i,
  /trade reference/i,
  /TRADE-REFERENCE/i,
  /reference notes/i,
  /groundwork('s)? (own )?(notes|reference)/i,
  /wikipedia|encyclop/i,
  /second-hand/i,
];
const PUBLISHED =
  /BS 7671|On-Site Guide|Energy Networks Association|Master Registration Agreement|SI 2002\/2665|IEC 62196|IET Code of Practice|Common practice — no published source/;

const TODAY = '2026-12-03';
const accepted = (kind: UploadSummary['kind']): UploadSummary => ({ kind, status: 'accepted' });
const everyUpload: UploadSummary[] = ['meter_photo', 'cutout_photo', 'consumer_unit_photo', 'charger_location_photo', 'parking_evidence', 'order_agreement', 'landlord_permission'].map((k) => accepted(k as UploadSummary['kind']));

type Scenario = { name: string; answers: ChecklistAnswers; site?: SiteMeasures; uploads?: UploadSummary[] };

function withSupply(base: ChecklistAnswers, supply: Partial<NonNullable<ChecklistAnswers['supply']>>): ChecklistAnswers {
  return { ...base, supply: { ...base.supply, ...supply } };
}
function withCharger(base: ChecklistAnswers, charger: Partial<NonNullable<ChecklistAnswers['charger']>>): ChecklistAnswers {
  return { ...base, charger: { ...base.charger, ...charger } };
}

/** Sweeps each answer that changes what a check says, one at a time, over the three demo homes. */
function scenarios(): Scenario[] {
  const homes = [heronChecklist(), forgeChecklist(), chandlersChecklist()] as ChecklistAnswers[];
  const list: Scenario[] = [{ name: 'nothing answered', answers: {} }];
  // A light home that may Connect & Notify: one 32 A socket circuit + lighting 0.66 × 2000 / 230
  // = 5.739 A + a 3.6 kW (16 A) charger = 53.74 A ≤ 60 A, within a 100 A cut-out, not looped.
  const light = withCharger(withSupply(chandlersChecklist() as ChecklistAnswers, { loads: { ...chandlersChecklist().supply.loads, socketCircuits: 1 } }), { ratingKw: 3.6 });
  list.push({ name: 'light home', answers: light }, { name: 'light home, measured', answers: light, site: { measuredMaxDemandAmps: 20 } });
  homes.forEach((home, h) => {
    list.push({ name: `home ${h}`, answers: home }, { name: `home ${h}, every upload accepted`, answers: home, uploads: everyUpload });
    for (const mainFuseAmps of [60, 80, 100, null] as const) list.push({ name: `home ${h}, fuse ${mainFuseAmps}`, answers: withSupply(home, { mainFuseAmps }) });
    for (const earthing of ['pme', 'tns', 'tt', 'unknown', null] as const) list.push({ name: `home ${h}, earthing ${earthing}`, answers: withSupply(home, { earthing }) });
    for (const looped of ['yes', 'no', 'unsure'] as const) list.push({ name: `home ${h}, looped ${looped}`, answers: withSupply(home, { looped }) });
    for (const phases of ['single', 'three', 'unsure'] as const) list.push({ name: `home ${h}, ${phases} phase`, answers: withSupply(home, { phases }) });
    // 24 + ten digits + check digit: a core that adds up but whose distributor ID is unfamiliar.
    for (const mpanCore of ['1312345678907', '1312345678900', '9912345678901', 'abc']) list.push({ name: `home ${h}, MPAN ${mpanCore}`, answers: withSupply(home, { mpanCore }) });
    for (const route of ['through-wall', 'along-wall', 'through-house', 'buried', null] as const) list.push({ name: `home ${h}, route ${route}`, answers: withCharger(home, { route }) });
    for (const ratingKw of [3.6, 7.4, 11, 22]) list.push({ name: `home ${h}, ${ratingKw} kW`, answers: withCharger(home, { ratingKw }) });
    for (const cableRunMetres of [3, 60, 140]) list.push({ name: `home ${h}, ${cableRunMetres} m`, answers: withCharger(home, { cableRunMetres }) });
    list.push({ name: `home ${h}, socketed`, answers: withCharger(home, { preference: 'socketed', tetherMetres: null }) });
    list.push({ name: `home ${h}, no plan`, answers: withCharger(home, { plan: null }) });
    for (const kind of ['attached-drive', 'garage', 'detached-bay', 'none'] as const) list.push({ name: `home ${h}, parking ${kind}`, answers: { ...home, parking: { ...home.parking, kind } } });
    list.push({ name: `home ${h}, delivery tomorrow`, answers: { ...home, vehicle: { ...home.vehicle, deliveryDate: '2026-12-04' } } });
    list.push({ name: `home ${h}, measured demand`, answers: home, site: { measuredMaxDemandAmps: 70 } });
    list.push({ name: `home ${h}, TT electrode recorded`, answers: withSupply(home, { earthing: 'tt' }), site: { earthingMeasure: 'tt-electrode', electrodeOhms: 250, rcdIdnMilliamps: 30 } });
    list.push({ name: `home ${h}, PME with a device`, answers: withSupply(home, { earthing: 'pme' }), site: { earthingMeasure: 'open-pen-device' } });
    list.push({ name: `home ${h}, an upload rejected`, answers: home, uploads: [{ kind: 'cutout_photo', status: 'rejected', reason: 'Too dark to read.' }] });
  });
  return list;
}

/** Every string anywhere in a check's output, with where it was found. */
function strings(value: unknown, at: string, out: { at: string; text: string }[] = []): { at: string; text: string }[] {
  if (typeof value === 'string') out.push({ at, text: value });
  else if (Array.isArray(value)) value.forEach((v, i) => strings(v, `${at}[${i}]`, out));
  else if (value && typeof value === 'object') for (const [k, v] of Object.entries(value)) strings(v, `${at}.${k}`, out);
  return out;
}

const results: { scenario: string; check: CheckResult }[] = scenarios().flatMap((s) =>
  runChecks({ answers: s.answers, site: s.site ?? {}, uploads: s.uploads ?? [], today: TODAY }).checks.map((check) => ({ scenario: s.name, check })),
);

describe('what staff read cites published documents', () => {
  it('walks a broad spread of answers (every check, many states)', () => {
    // Guard against a walk that quietly covers nothing.
    expect(results.length).toBeGreaterThan(9 * 100);
    expect(new Set(results.map((r) => `${r.check.id}:${r.check.light}`)).size).toBeGreaterThan(15);
  });

  it('no output of any check cites our own notes, an encyclopedia or "from memory"', () => {
    const bad = results.flatMap(({ scenario, check }) =>
      strings(check, check.id)
        .filter(({ text }) => FORBIDDEN.some((re) => re.test(text)))
        .map(({ at, text }) => `${scenario} → ${at}: ${text}`),
    );
    expect([...new Set(bad)]).toEqual([]);
  });

  it('ends every sentence once (a typed reason with its own full stop included)', () => {
    const bad = results.flatMap(({ scenario, check }) =>
      [check.customerText, check.staffText, ...check.actions].filter((t) => /[.!?][)”"’]?\.(?!\d)/.test(t)).map((t) => `${scenario} → ${check.id}: ${t}`),
    );
    expect([...new Set(bad)]).toEqual([]);
  });

  it('every check source names a published document or says common practice', () => {
    const bad = results.filter(({ check }) => !PUBLISHED.test(check.source)).map(({ check }) => `${check.id}: ${check.source}`);
    expect([...new Set(bad)]).toEqual([]);
  });

  it('every setting source on the settings page does too', () => {
    for (const [key, d] of Object.entries(settingDescriptions)) {
      expect(`${key}: ${d.source}`).toMatch(PUBLISHED);
      for (const text of [d.label, d.meaning, d.source]) for (const re of FORBIDDEN) expect(`${key}: ${text}`).not.toMatch(re);
    }
  });

  it('every caution in the pack names its published source', () => {
    expect(packCautions.length).toBeGreaterThan(3);
    for (const c of packCautions) {
      expect(c.source).toMatch(PUBLISHED);
      for (const re of FORBIDDEN) expect(`${c.text} (${c.source})`).not.toMatch(re);
    }
  });

  it('calls the network operator routes by the trade body’s own names', () => {
    // ENA: "Connect & Notify" (its FAQ on connecting EVs and heat pumps) and "Apply to Connect".
    expect(networkRouteNames).toEqual({ 'notify-after': 'Connect & Notify', 'apply-before': 'Apply to Connect' });
    const network = results.filter(({ check }) => check.id === 'network-operator').map(({ check }) => check);
    const routes = new Set(network.map((c) => c.figures.route));
    expect(routes).toEqual(new Set(['notify-after', 'apply-before']));
    for (const c of network) {
      const name = networkRouteNames[c.figures.route as 'notify-after' | 'apply-before'];
      expect(c.figures.routeName).toBe(name);
      expect(c.staffText).toContain(name);
      expect(c.source).toContain('Energy Networks Association');
    }
  });
});
