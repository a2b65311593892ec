// Supply headroom: does the main fuse (cut-out) cover the home's assessed maximum demand with
// the new charger running at full load, and does the supply have the phases the charger needs?
import { withArticle } from '@/lib/grammar';
import { assessMaximumDemand, REG_722_311, TABLE_A2, type DemandAssessment } from '@/lib/readiness/demand';
import { atLeast, worstLight } from '@/lib/readiness/lights';
import { COMMON_PRACTICE, type ReadinessSettings } from '@/lib/readiness/settings';
import type { CheckInput, CheckResult, ChecklistAnswers, Light } from '@/lib/readiness/types';
import { formatNumber, roundTo } from '@/lib/readiness/units';
import { checkTitles } from '../check-titles';

/** Largest standard domestic cut-out rating (BS 7657 ratings 60, 80, 100 A). */
export const LARGEST_DOMESTIC_FUSE_AMPS = 100;

const SOURCE = `${TABLE_A2}; ${REG_722_311}; 230 V nominal: ESQCR 2002 (SI 2002/2665); 11 kW ≈ 16 A and 22 kW ≈ 32 A per phase: ${COMMON_PRACTICE}; 60 A usually needs an upgrade, 100 A usually fine: ${COMMON_PRACTICE}`;
const TITLE = checkTitles['supply-headroom'];
const FUSE_CAUTION =
  "Please don't open the cut-out or remove any covers: only your network operator may change the main fuse.";

/** Whether the supply has the phases the chosen charge point needs. */
export type PhaseFit = 'fits' | 'needs-three-phase' | 'phases-unknown';

/**
 * An 11 or 22 kW charge point needs a three-phase supply.
 *
 * @example phaseFit({ supply: { phases: 'single' }, charger: { ratingKw: 22 } }) // 'needs-three-phase'
 */
export function phaseFit(answers: ChecklistAnswers, demand: Pick<DemandAssessment, 'charger'>): PhaseFit {
  if (demand.charger.phases === 1) return 'fits';
  const phases = answers.supply?.phases;
  if (phases === 'three') return 'fits';
  return phases === 'single' ? 'needs-three-phase' : 'phases-unknown';
}

/**
 * Rates the assessed maximum demand against the main fuse: red when the demand is known to
 * exceed it (or a three-phase charger meets a single-phase supply), amber within the margin, on
 * a small fuse, or while the estimate rests on unanswered questions.
 *
 * @example checkSupplyHeadroom({ answers: { supply: { mainFuseAmps: 100, loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 2 } }, charger: { ratingKw: 7.4 } }, uploads: [], site: {}, settings: defaultReadinessSettings, today: '2025-01-01' }).light
 * // 'green' (32 + 12.8 sockets + 5.74 lighting + 32 charger = 82.54 A of 100 A, 17.46 A spare)
 */
export function checkSupplyHeadroom({ answers, site, settings }: CheckInput): CheckResult {
  const demand = assessMaximumDemand(answers, site, settings);
  const fuseAmps = typeof answers.supply?.mainFuseAmps === 'number' ? answers.supply.mainFuseAmps : null;
  const fit = phaseFit(answers, demand);
  const result = fuseAmps === null ? unknownFuseResult(demand, settings) : knownFuseResult(demand, fuseAmps, settings);
  return withPhaseFit(result, fit, demand);
}

function withPhaseFit(result: CheckResult, fit: PhaseFit, demand: DemandAssessment): CheckResult {
  const figures = { ...result.figures, phaseFit: fit };
  if (fit === 'fits') return { ...result, figures };
  const kw = formatNumber(demand.charger.ratingKw);
  const known = fit === 'needs-three-phase';
  return {
    ...result,
    light: worstLight([result.light, known ? 'red' : 'amber']),
    customerText: known
      ? `${capital(withArticle(`${kw} kW charge point`))} needs a three-phase supply, and you told us yours is single phase. A 7.4 kW charge point suits a single-phase home; or your network operator can say whether three phases could be brought in. ${result.customerText}`
      : `${capital(withArticle(`${kw} kW charge point`))} needs a three-phase supply. Please tell us whether yours is single or three phase (the photos of your meter and cut-out usually show it). ${result.customerText}`,
    staffText: `${known ? 'Three-phase charge point on a single-phase supply: cannot be connected at its rating.' : 'Three-phase charge point; supply phases not known.'} ${result.staffText}`,
    figures,
    actions: [
      known ? 'Choose a charge point of 7.4 kW or less, or ask the network operator about a three-phase supply.' : 'Tell us whether the supply is single or three phase.',
      ...result.actions,
    ],
  };
}

function demandFigures(demand: DemandAssessment, settings: ReadinessSettings) {
  return {
    basis: demand.basis,
    assessedDemandAmps: demand.assessedDemandAmps,
    lowerBoundDemandAmps: demand.lowerBoundDemandAmps,
    existingDemandAmps: demand.existingDemandAmps,
    chargerAmps: demand.chargerAmps,
    chargerKw: demand.charger.ratingKw,
    chargerPhases: demand.charger.phases,
    chargerChosen: demand.charger.chosen,
    supplyPhases: demand.supplyPhases,
    phaseDemandAmps: demand.phaseDemandAmps,
    marginAmps: settings.headroomMarginAmps,
    loadsDeclared: demand.loadsDeclared,
    firm: demand.firm,
    assumptions: demand.assumptions,
    items: demand.items,
  };
}

function knownFuseResult(demand: DemandAssessment, fuseAmps: number, settings: ReadinessSettings): CheckResult {
  const headroom = fuseAmps - demand.assessedDemandAmps;
  const light = headroomLight(headroom, fuseAmps, demand, settings);
  return {
    id: 'supply-headroom',
    light,
    title: TITLE,
    customerText: knownFuseCustomerText(light, demand, fuseAmps, headroom, settings),
    staffText: knownFuseStaffText(demand, fuseAmps, headroom, settings),
    figures: { ...demandFigures(demand, settings), fuseAmps, headroomAmps: roundTo(headroom, 2) },
    source: SOURCE,
    actions: knownFuseActions(light, headroom, fuseAmps, demand, settings),
  };
}

/**
 * Red only when the demand is known to exceed the fuse: a firm (or measured) figure over it, or
 * even the least it could be over it. Otherwise amber for too little spare, a small fuse, or an
 * estimate that rests on unanswered questions; green needs a firm figure with room to spare.
 *
 * @example headroomLight(17.46, 100, { firm: true, lowerBoundDemandAmps: 82.54 }, defaultReadinessSettings) // 'green'
 */
export function headroomLight(
  headroomAmps: number,
  fuseAmps: number,
  demand: Pick<DemandAssessment, 'firm' | 'lowerBoundDemandAmps'>,
  settings: ReadinessSettings,
): Light {
  if (demand.lowerBoundDemandAmps > fuseAmps) return 'red';
  if (headroomAmps < 0) return demand.firm ? 'red' : 'amber';
  let light: Light = headroomAmps < settings.headroomMarginAmps ? 'amber' : 'green';
  if (fuseAmps <= settings.smallFuseAmps) light = atLeast(light, 'amber');
  if (!demand.firm) light = atLeast(light, 'amber');
  return light;
}

function mostText(demand: DemandAssessment): string {
  const measured = demand.basis === 'measured' ? ', using the readings taken of your home’s actual use,' : '';
  const phase = demand.supplyPhases === 3 ? ' on the busiest of your three phases' : '';
  return `The most your home could draw at once${measured} with the new charge point running flat out works out at about ${formatNumber(demand.assessedDemandAmps)} A${phase}`;
}

function knownFuseCustomerText(
  light: Light,
  demand: DemandAssessment,
  fuseAmps: number,
  headroom: number,
  settings: ReadinessSettings,
): string {
  const most = mostText(demand);
  if (light === 'red') {
    return `${most} — more than your ${fuseAmps} A main fuse. This is common and can be sorted: your installer can fit a device that slows charging when the house is busy, or your network operator can upgrade the fuse. ${FUSE_CAUTION}`;
  }
  if (light === 'green') {
    return `${most}, comfortably within your ${fuseAmps} A main fuse (about ${formatNumber(headroom)} A to spare).`;
  }
  const notes: string[] = [];
  if (headroom < 0) {
    notes.push(`${most}, which could be more than your ${fuseAmps} A main fuse — but that figure rests on some guesses.`);
  } else if (headroom < settings.headroomMarginAmps) {
    notes.push(`${most}, within your ${fuseAmps} A main fuse but with only about ${formatNumber(headroom)} A to spare, so your installer may fit a device that slows charging when the house is busy.`);
  } else {
    notes.push(`${most}, within your ${fuseAmps} A main fuse.`);
  }
  if (fuseAmps <= settings.smallFuseAmps) notes.push(`${capital(withArticle(`${fuseAmps} A main fuse`))} is on the small side for a charge point, so your installer will look at it closely.`);
  if (!demand.firm) notes.push(unansweredText(demand));
  notes.push(FUSE_CAUTION);
  return notes.join(' ');
}

function unansweredText(demand: DemandAssessment): string {
  if (!demand.loadsDeclared) return "We haven't heard about all of your big electrical appliances yet, so this may go up.";
  return 'We don’t know how many socket circuits your home has, so this is a rough figure; the labels in your consumer unit usually tell.';
}

function workingText(demand: DemandAssessment): string {
  const existing =
    demand.basis === 'measured'
      ? `existing ${formatNumber(demand.existingDemandAmps, 2)} A measured (smart-meter or logger data)`
      : `existing ${formatNumber(demand.existingDemandAmps, 2)} A after OSG Table A2 diversity`;
  const phases = demand.phaseDemandAmps ? ` Per phase with the charger: ${demand.phaseDemandAmps.map((a) => formatNumber(a, 2)).join(' / ')} A.` : '';
  const least = demand.firm ? '' : ` Not firm: at least ${formatNumber(demand.lowerBoundDemandAmps, 2)} A. ${demand.assumptions.join(' ')}`;
  return `Assessed maximum demand ${formatNumber(demand.assessedDemandAmps, 2)} A (${existing} + ${formatNumber(demand.chargerAmps, 2)} A charger at full load, 722.311).${phases}${least}`;
}

function knownFuseStaffText(demand: DemandAssessment, fuseAmps: number, headroom: number, settings: ReadinessSettings): string {
  const verdict =
    headroom < 0
      ? `Over the ${fuseAmps} A cut-out by ${formatNumber(-headroom, 2)} A: supply upgrade (DNO) or EVSE load limiting / load management needed.`
      : `Headroom on the ${fuseAmps} A cut-out ${formatNumber(headroom, 2)} A (margin ${settings.headroomMarginAmps} A)${headroom < settings.headroomMarginAmps ? ': load management likely.' : '.'}`;
  return `${workingText(demand)} ${verdict}`;
}

function knownFuseActions(
  light: Light,
  headroom: number,
  fuseAmps: number,
  demand: DemandAssessment,
  settings: ReadinessSettings,
): string[] {
  if (light === 'green') return [];
  const actions: string[] = [];
  if (!demand.loadsDeclared) actions.push('Answer every question about the big electrical appliances (shower, cooker, heating, socket circuits) in the supply step.');
  else if (!demand.firm) actions.push('Count the socket circuits from the consumer unit labels, or the office to record a measured maximum demand.');
  if (headroom < settings.headroomMarginAmps || fuseAmps <= settings.smallFuseAmps) {
    actions.push('The installer to plan a load-limiting (load management) device, or ask the network operator about a main fuse upgrade; a measured maximum demand may show more room.');
  }
  return actions;
}

function unknownFuseResult(demand: DemandAssessment, settings: ReadinessSettings): CheckResult {
  // No domestic cut-out is larger than 100 A, so beyond it the answer is known.
  const overEveryRating = demand.lowerBoundDemandAmps > LARGEST_DOMESTIC_FUSE_AMPS;
  const light: Light = overEveryRating ? 'red' : 'amber';
  const headroomByRating = Object.fromEntries(
    [60, 80, 100].map((rating) => [String(rating), roundTo(rating - demand.assessedDemandAmps, 2)]),
  );
  const customerText = overEveryRating
    ? `We couldn't read your main fuse, but the most your home could draw at once with the new charge point works out at about ${formatNumber(demand.assessedDemandAmps)} A — more than even the largest household fuse (100 A). Your installer will plan a device that slows charging when the house is busy, or ask the network operator about an upgrade. ${FUSE_CAUTION}`
    : `We don't know your main fuse rating yet, so we can't tell whether there is room for the charge point. A clear photo of the cut-out (the sealed box where the supply cable comes in) usually shows it. ${FUSE_CAUTION}`;
  return {
    id: 'supply-headroom',
    light,
    title: TITLE,
    customerText,
    staffText: `Cut-out rating unknown. ${workingText(demand)} Headroom at 60/80/100 A: ${[60, 80, 100].map((r) => formatNumber(r - demand.assessedDemandAmps, 2)).join(' / ')} A.`,
    figures: { ...demandFigures(demand, settings), fuseAmps: null, headroomAmps: null, headroomByRating },
    source: SOURCE,
    actions: [
      'Send a clear photo of the cut-out showing its fuse rating (photos only; never open it).',
      ...(overEveryRating ? ['The installer to plan load limiting or a supply upgrade with the network operator.'] : []),
    ],
  };
}

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
