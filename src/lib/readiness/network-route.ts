// The network-operator route by the ENA criteria, shared by the network-operator check and the
// timing check (which adds the lead time when the job must apply first).
import { assessMaximumDemand } from './demand';
import type { ReadinessSettings } from './settings';
import type { ChecklistAnswers } from './types';
import { formatNumber } from './units';

export const ENA_SOURCE =
  'Energy Networks Association, "Connecting electric vehicles and heat pumps" and its EV charge point / heat pump application form';

export type NetworkRoute = 'notify-after' | 'apply-before';
export type NetworkReasonCode =
  | 'demand-over-cutout'
  | 'demand-over-limit'
  | 'looped-supply'
  | 'looped-unknown'
  | 'cutout-unknown';

export interface NetworkReason {
  code: NetworkReasonCode;
  text: string;
}

export interface NetworkRouteDecision {
  route: NetworkRoute;
  reasons: NetworkReason[];
  /** False while an answer the route depends on is unknown (fuse, looped, loads). */
  settled: boolean;
  assessedDemandAmps: number;
  fuseAmps: number | null;
}

/**
 * Applies the ENA criteria: apply before connecting when demand exceeds the cut-out or the
 * single-phase limit, the supply is looped, or the cut-out is unknown; otherwise notify after.
 * An unanswered "looped" question is treated as possibly looped until settled.
 *
 * @example decideNetworkRoute({ supply: { mainFuseAmps: 100, looped: 'no', loads: {} } }, defaultReadinessSettings).route
 * // 'notify-after' (10 A baseline + 32 A charger = 42 A, under 60 A)
 */
export function decideNetworkRoute(answers: ChecklistAnswers, settings: ReadinessSettings): NetworkRouteDecision {
  const supply = answers.supply ?? {};
  const demand = assessMaximumDemand(supply.loads, settings);
  const fuseAmps = typeof supply.mainFuseAmps === 'number' ? supply.mainFuseAmps : null;
  const looped = supply.looped ?? null;
  const reasons = [
    ...demandReasons(demand.assessedDemandAmps, fuseAmps, settings),
    ...loopedReasons(looped),
    ...(fuseAmps === null ? [reason('cutout-unknown', 'The cut-out (main fuse) rating is not known.')] : []),
  ];
  return {
    route: reasons.length > 0 ? 'apply-before' : 'notify-after',
    reasons,
    settled: fuseAmps !== null && (looped === 'yes' || looped === 'no') && demand.loadsDeclared,
    assessedDemandAmps: demand.assessedDemandAmps,
    fuseAmps,
  };
}

function demandReasons(demandAmps: number, fuseAmps: number | null, settings: ReadinessSettings): NetworkReason[] {
  const reasons: NetworkReason[] = [];
  if (fuseAmps !== null && demandAmps > fuseAmps) {
    reasons.push(reason('demand-over-cutout', `New maximum demand ${formatNumber(demandAmps, 2)} A exceeds the ${fuseAmps} A cut-out.`));
  }
  if (demandAmps > settings.enaDemandLimitAmps) {
    const kva = (settings.enaDemandLimitAmps * settings.nominalVoltage) / 1000;
    reasons.push(
      reason(
        'demand-over-limit',
        `New maximum demand ${formatNumber(demandAmps, 2)} A exceeds ${settings.enaDemandLimitAmps} A (${formatNumber(kva)} kVA single phase).`,
      ),
    );
  }
  return reasons;
}

function loopedReasons(looped: string | null): NetworkReason[] {
  if (looped === 'yes') return [reason('looped-supply', 'The supply is looped (shared service cable).')];
  if (looped === 'no') return [];
  return [reason('looped-unknown', 'Not yet known whether the supply is looped.')];
}

function reason(code: NetworkReasonCode, text: string): NetworkReason {
  return { code, text };
}
