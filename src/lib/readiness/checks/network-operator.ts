// Network operator: can the job install and notify within 28 days, or must it apply first?
import { checkMpanCore } from '@/lib/validation/mpan';
import { decideNetworkRoute, ENA_SOURCE, networkRouteNames, type NetworkRouteDecision } from '@/lib/readiness/network-route';
import { COMMON_PRACTICE, type ReadinessSettings } from '@/lib/readiness/settings';
import type { CheckInput, CheckResult, Light } from '@/lib/readiness/types';
import { checkTitles } from '@/lib/readiness/check-titles';

const SOURCE = `${ENA_SOURCE}; lead time of a supply upgrade: ${COMMON_PRACTICE}`;

/**
 * Notify-after and settled is green; apply-before, or anything still unknown, is amber.
 *
 * @example checkNetworkOperator({ answers: { supply: { mainFuseAmps: 100, looped: 'yes', loads: {} } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).figures.route
 * // 'apply-before'
 */
export function checkNetworkOperator({ answers, site, settings }: CheckInput): CheckResult {
  const decision = decideNetworkRoute(answers, site, settings);
  const light: Light = decision.route === 'notify-after' && decision.settled ? 'green' : 'amber';
  const region = regionOf(answers.supply?.mpanCore);
  return {
    id: 'network-operator',
    light,
    title: checkTitles['network-operator'],
    customerText: customerText(decision, settings),
    staffText: staffText(decision, region, settings),
    figures: {
      route: decision.route,
      reasons: decision.reasons,
      settled: decision.settled,
      applyBeforeKnown: decision.applyBeforeKnown,
      routeName: networkRouteNames[decision.route],
      supplyPhases: decision.supplyPhases,
      leadTimeDays: decision.route === 'apply-before' ? settings.supplyUpgradeLeadDays : 0,
      notifyWithinDays: settings.notifyWithinDays,
      assessedDemandAmps: decision.assessedDemandAmps,
      fuseAmps: decision.fuseAmps,
      demandLimitAmps: settings.enaDemandLimitAmps,
      region,
    },
    source: SOURCE,
    actions: actions(decision),
  };
}

function regionOf(mpanCore: string | null | undefined): string | null {
  if (!mpanCore) return null;
  const checked = checkMpanCore(mpanCore);
  return checked.ok ? checked.region : null;
}

function customerText(decision: NetworkRouteDecision, settings: ReadinessSettings): string {
  if (decision.route === 'notify-after') {
    const pending = decision.settled ? '' : ' We still need one or two answers about your supply to be sure.';
    return `Your installer can fit the charge point and then let your local network operator know within ${settings.notifyWithinDays} days — nothing for you to arrange.${pending}`;
  }
  const onlyUnknowns = !decision.applyBeforeKnown;
  const need = onlyUnknowns
    ? 'Until we know a little more about your supply, we plan as if your installer must apply to your local network operator (the company that runs the cables to your street) before the charge point is connected.'
    : 'Before the charge point is connected, your installer needs to apply to your local network operator (the company that runs the cables to your street).';
  return `${need} That can take from under a week to about a month, so we start early — there is nothing you need to arrange yourself.`;
}

function staffText(decision: NetworkRouteDecision, region: string | null, settings: ReadinessSettings): string {
  const area = region ? ` DNO region: ${region}.` : '';
  if (decision.route === 'notify-after') {
    const pending = decision.settled ? '' : ' Not settled: fuse, looped supply or loads still unknown.';
    const perPhase = decision.supplyPhases === 3 ? ' per phase' : '';
    return `ENA ${networkRouteNames['notify-after']}: all notification criteria met (demand ${decision.assessedDemandAmps} A${perPhase} ≤ ${settings.enaDemandLimitAmps} A and within the cut-out, charge point ≤ 32 A per phase, not looped). Notify within ${settings.notifyWithinDays} days of connection.${pending}${area}`;
  }
  const why = decision.reasons.map((r) => `${r.text}${r.certain ? '' : ' (possible: answer missing)'}`).join(' ');
  return `ENA ${networkRouteNames['apply-before']}${decision.applyBeforeKnown ? '' : ' assumed until answers are in'}: ${why} Allow ${settings.supplyUpgradeLeadDays} days (common practice).${area}`;
}

function actions(decision: NetworkRouteDecision): string[] {
  const list: string[] = [];
  const codes = new Set(decision.reasons.map((r) => r.code));
  if (codes.has('cutout-unknown')) list.push('Send a clear photo of the cut-out so the fuse rating can be read (photos only).');
  if (codes.has('looped-unknown')) list.push('Find out whether the supply is looped (shared with a neighbour): the surveyor or network operator can confirm.');
  if (codes.has('demand-may-exceed')) list.push('Answer the remaining load questions, or the office to record a measured maximum demand.');
  if (decision.route === 'apply-before' && decision.applyBeforeKnown) {
    list.push('The office to apply to the network operator before the install date.');
  }
  if (decision.route === 'notify-after' && !decision.settled) list.push('Answer every question about the big electrical appliances in the supply step.');
  return list;
}
