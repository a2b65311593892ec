// The network-operator route by the ENA criteria, shared by the network-operator check and the
// timing check (which adds the lead time when the job must apply first).
import { assessMaximumDemand } from './demand';
import type { ReadinessSettings } from './settings';
import type { ChecklistAnswers, SiteMeasures } from './types';
import { formatNumber } from './units';

export const ENA_SOURCE =
  'Energy Networks Association, "Connecting electric vehicles and heat pumps" and its EV charge point / heat pump application form (Connect & Notify, Apply to Connect)';

/**
 * The trade body's own names for its two routes, as staff read them. Where each name comes from:
 * "Connect & Notify" is written so in the ENA's "Frequently asked questions about connecting to
 * the networks" (energynetworks.org, beside "Connecting electric vehicles and heat pumps");
 * "Apply to Connect" stands beside it on NIE Networks' "Process for connecting new LCTs" page,
 * which says the process is maintained by the ENA's Low Carbon Technologies Working Group.
 * Both were read through the project's web search of published pages, not in the form itself.
 *
 * @example networkRouteNames['notify-after'] // 'Connect & Notify'
 */
export const networkRouteNames = Object.freeze({ 'notify-after': 'Connect & Notify', 'apply-before': 'Apply to Connect' } as const);

/** The ENA form's per-phase limit for a charge point that may connect and notify (from memory). */
export const ENA_CHARGER_LIMIT_AMPS_PER_PHASE = 32;

/** Our ids for the trade body's two routes: see networkRouteNames for the names staff read. */
export type NetworkRoute = 'notify-after' | 'apply-before';
export type NetworkReasonCode =
  | 'demand-over-cutout'
  | 'demand-over-limit'
  | 'demand-may-exceed'
  | 'charger-over-32a-per-phase'
  | 'looped-supply'
  | 'looped-unknown'
  | 'cutout-unknown';

export interface NetworkReason {
  code: NetworkReasonCode;
  text: string;
  /** True when the reason is known; false when it only may apply because an answer is missing. */
  certain: boolean;
}

export interface NetworkRouteDecision {
  route: NetworkRoute;
  reasons: NetworkReason[];
  /** False while an answer the route depends on is unknown (fuse, looped, loads). */
  settled: boolean;
  /** True when a known reason (not only a missing answer) means applying first. */
  applyBeforeKnown: boolean;
  assessedDemandAmps: number;
  fuseAmps: number | null;
  supplyPhases: 1 | 3;
}

/**
 * Applies the ENA criteria: apply before connecting when demand exceeds the cut-out or the
 * 60 A limit (per phase on three phases, from memory), the charge point draws more than 32 A per
 * phase, the supply is looped, or the cut-out is unknown; otherwise connect and notify. A missing
 * answer makes the reason possible, not certain.
 *
 * @example decideNetworkRoute({ supply: { mainFuseAmps: 100, looped: 'yes' } }, {}, defaultReadinessSettings).applyBeforeKnown // true
 */
export function decideNetworkRoute(answers: ChecklistAnswers, site: SiteMeasures, settings: ReadinessSettings): NetworkRouteDecision {
  const supply = answers.supply ?? {};
  const demand = assessMaximumDemand(answers, site, settings);
  const fuseAmps = typeof supply.mainFuseAmps === 'number' ? supply.mainFuseAmps : null;
  const looped = supply.looped ?? null;
  const reasons = [
    ...demandReasons(demand.assessedDemandAmps, demand.lowerBoundDemandAmps, demand.firm, fuseAmps, demand.supplyPhases, settings),
    ...chargerReasons(demand.charger.ampsPerPhase),
    ...loopedReasons(looped),
    ...(fuseAmps === null ? [reason('cutout-unknown', 'The cut-out (main fuse) rating is not known.', false)] : []),
  ];
  return {
    route: reasons.length > 0 ? 'apply-before' : 'notify-after',
    reasons,
    settled: fuseAmps !== null && (looped === 'yes' || looped === 'no') && demand.firm,
    applyBeforeKnown: reasons.some((r) => r.certain),
    assessedDemandAmps: demand.assessedDemandAmps,
    fuseAmps,
    supplyPhases: demand.supplyPhases,
  };
}

function demandReasons(
  demandAmps: number,
  leastAmps: number,
  firm: boolean,
  fuseAmps: number | null,
  phases: 1 | 3,
  settings: ReadinessSettings,
): NetworkReason[] {
  const reasons: NetworkReason[] = [];
  const perPhase = phases === 3 ? ' per phase' : '';
  const over = (limit: number) => ({ known: leastAmps > limit || (firm && demandAmps > limit), possible: demandAmps > limit });
  if (fuseAmps !== null) {
    const cutout = over(fuseAmps);
    if (cutout.known) reasons.push(reason('demand-over-cutout', `New maximum demand ${formatNumber(demandAmps, 2)} A${perPhase} exceeds the ${fuseAmps} A cut-out.`, true));
  }
  const limit = over(settings.enaDemandLimitAmps);
  // The per-phase reading of the 60 A criterion on three phases is from memory, not seen in the form.
  if (limit.known) {
    const kva = (settings.enaDemandLimitAmps * settings.nominalVoltage) / 1000;
    const what = phases === 3 ? `${settings.enaDemandLimitAmps} A per phase (three-phase criterion: confirm against the current application form)` : `${settings.enaDemandLimitAmps} A (${formatNumber(kva)} kVA single phase)`;
    reasons.push(reason('demand-over-limit', `New maximum demand ${formatNumber(demandAmps, 2)} A${perPhase} exceeds ${what}.`, true));
  }
  const cutoutPossible = fuseAmps !== null && over(fuseAmps).possible && !over(fuseAmps).known;
  if ((limit.possible && !limit.known) || cutoutPossible) {
    reasons.push(reason('demand-may-exceed', `The estimate (${formatNumber(demandAmps, 2)} A${perPhase}) may exceed a limit, but rests on unanswered questions (at least ${formatNumber(leastAmps, 2)} A).`, false));
  }
  return reasons;
}

function chargerReasons(ampsPerPhase: number): NetworkReason[] {
  if (ampsPerPhase <= ENA_CHARGER_LIMIT_AMPS_PER_PHASE) return [];
  return [reason('charger-over-32a-per-phase', `The charge point draws ${ampsPerPhase} A per phase, above ${ENA_CHARGER_LIMIT_AMPS_PER_PHASE} A.`, true)];
}

function loopedReasons(looped: string | null): NetworkReason[] {
  if (looped === 'yes') return [reason('looped-supply', 'The supply is looped (shared service cable).', true)];
  if (looped === 'no') return [];
  return [reason('looped-unknown', 'Not yet known whether the supply is looped.', false)];
}

function reason(code: NetworkReasonCode, text: string, certain: boolean): NetworkReason {
  return { code, text, certain };
}
