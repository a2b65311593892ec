// Supply headroom: does the main fuse (cut-out) cover the home's assessed maximum demand with
// the new charger running at full load?
import { assessMaximumDemand, REG_722_311, TABLE_A2, type DemandAssessment } from '../demand';
import { atLeast } from '../lights';
import { COMMON_PRACTICE, type ReadinessSettings } from '../settings';
import type { CheckInput, CheckResult, Light } from '../types';
import { formatNumber, roundTo } from '../units';

/** Largest standard domestic cut-out rating (BS 7657 ratings 60, 80, 100 A). */
export const LARGEST_DOMESTIC_FUSE_AMPS = 100;

const SOURCE = `${TABLE_A2}; ${REG_722_311}; 230 V nominal: ESQCR 2002 (SI 2002/2665); 60 A usually needs an upgrade, 100 A usually fine: ${COMMON_PRACTICE}`;
const FUSE_CAUTION =
  "Please don't open the cut-out or remove any covers: only your network operator may change the main fuse.";

/**
 * Rates the assessed maximum demand against the main fuse: red over the fuse, amber within the
 * margin, on a small fuse, or when the fuse or the loads are not known yet.
 *
 * @example checkSupplyHeadroom({ answers: { supply: { mainFuseAmps: 100, loads: { showerKw: 10.5 } } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).light
 * // 'green' (87.65 A of 100 A, 12.35 A spare)
 */
export function checkSupplyHeadroom({ answers, settings }: CheckInput): CheckResult {
  const supply = answers.supply ?? {};
  const demand = assessMaximumDemand(supply.loads, settings);
  const fuseAmps = typeof supply.mainFuseAmps === 'number' ? supply.mainFuseAmps : null;
  return fuseAmps === null ? unknownFuseResult(demand, settings) : knownFuseResult(demand, fuseAmps, settings);
}

function knownFuseResult(demand: DemandAssessment, fuseAmps: number, settings: ReadinessSettings): CheckResult {
  const headroom = fuseAmps - demand.assessedDemandAmps;
  const light = headroomLight(headroom, fuseAmps, demand.loadsDeclared, settings);
  return {
    id: 'supply-headroom',
    light,
    title: 'Room on your supply for the charger',
    customerText: knownFuseCustomerText(light, demand, fuseAmps, headroom, settings),
    staffText: knownFuseStaffText(demand, fuseAmps, headroom, settings),
    figures: {
      assessedDemandAmps: demand.assessedDemandAmps,
      existingDemandAmps: demand.existingDemandAmps,
      chargerAmps: demand.chargerAmps,
      fuseAmps,
      headroomAmps: roundTo(headroom, 2),
      marginAmps: settings.headroomMarginAmps,
      loadsDeclared: demand.loadsDeclared,
      items: demand.items,
    },
    source: SOURCE,
    actions: knownFuseActions(light, headroom, fuseAmps, demand.loadsDeclared, settings),
  };
}

/**
 * Over the fuse is red; less spare than the margin, a small fuse or undeclared loads are amber.
 *
 * @example headroomLight(12.35, 100, true, defaultReadinessSettings) // 'green'
 */
export function headroomLight(
  headroomAmps: number,
  fuseAmps: number,
  loadsDeclared: boolean,
  settings: ReadinessSettings,
): Light {
  if (headroomAmps < 0) return 'red';
  let light: Light = headroomAmps < settings.headroomMarginAmps ? 'amber' : 'green';
  if (fuseAmps <= settings.smallFuseAmps) light = atLeast(light, 'amber');
  if (!loadsDeclared) light = atLeast(light, 'amber');
  return light;
}

function knownFuseCustomerText(
  light: Light,
  demand: DemandAssessment,
  fuseAmps: number,
  headroom: number,
  settings: ReadinessSettings,
): string {
  const most = `The most your home could draw at once, with the new charger running flat out, works out at about ${formatNumber(demand.assessedDemandAmps)} A`;
  if (light === 'red') {
    return `${most} — more than your ${fuseAmps} A main fuse. This is common and can be sorted: the installer can fit a device that slows charging when the house is busy, or your network operator can upgrade the fuse. ${FUSE_CAUTION}`;
  }
  if (light === 'green') {
    return `${most}, comfortably within your ${fuseAmps} A main fuse (about ${formatNumber(headroom)} A to spare).`;
  }
  const notes: string[] = [];
  notes.push(
    headroom < settings.headroomMarginAmps
      ? `${most}, within your ${fuseAmps} A main fuse but with only about ${formatNumber(headroom)} A to spare, so the installer may fit a device that slows charging when the house is busy.`
      : `${most}, within your ${fuseAmps} A main fuse.`,
  );
  if (fuseAmps <= settings.smallFuseAmps) notes.push(`A ${fuseAmps} A main fuse is on the small side for a charger, so the installer will look at it closely.`);
  if (!demand.loadsDeclared) notes.push("We haven't heard about your big electrical appliances yet, so this may go up.");
  notes.push(FUSE_CAUTION);
  return notes.join(' ');
}

function knownFuseStaffText(
  demand: DemandAssessment,
  fuseAmps: number,
  headroom: number,
  settings: ReadinessSettings,
): string {
  const working = `Assessed maximum demand ${formatNumber(demand.assessedDemandAmps, 2)} A (existing ${formatNumber(demand.existingDemandAmps, 2)} A after OSG Table A2 diversity + ${formatNumber(demand.chargerAmps, 2)} A charger at full load, 722.311) against a ${fuseAmps} A cut-out`;
  const verdict =
    headroom < 0
      ? `over by ${formatNumber(-headroom, 2)} A: supply upgrade (DNO) or EVSE load limiting / load management needed.`
      : `headroom ${formatNumber(headroom, 2)} A (margin ${settings.headroomMarginAmps} A)${headroom < settings.headroomMarginAmps ? ': load management likely.' : '.'}`;
  const loads = demand.loadsDeclared ? '' : ' Existing loads not declared yet: demand is a lower bound.';
  return `${working}: ${verdict}${loads}`;
}

function knownFuseActions(
  light: Light,
  headroom: number,
  fuseAmps: number,
  loadsDeclared: boolean,
  settings: ReadinessSettings,
): string[] {
  if (light === 'green') return [];
  const actions: string[] = [];
  if (!loadsDeclared) actions.push('Tell us about your big electrical appliances (shower, cooker, heating) in the supply step.');
  if (headroom < settings.headroomMarginAmps || fuseAmps <= settings.smallFuseAmps) {
    actions.push('The installer to plan a load-limiting (load management) device, or ask the network operator about a main fuse upgrade.');
  }
  return actions;
}

function unknownFuseResult(demand: DemandAssessment, settings: ReadinessSettings): CheckResult {
  // No domestic single-phase cut-out is larger than 100 A, so beyond it the answer is known.
  const overEveryRating = demand.assessedDemandAmps > LARGEST_DOMESTIC_FUSE_AMPS;
  const light: Light = overEveryRating ? 'red' : 'amber';
  const headroomByRating = Object.fromEntries(
    [60, 80, 100].map((rating) => [String(rating), roundTo(rating - demand.assessedDemandAmps, 2)]),
  );
  const customerText = overEveryRating
    ? `We couldn't read your main fuse, but the most your home could draw at once with the new charger works out at about ${formatNumber(demand.assessedDemandAmps)} A — more than even the largest household fuse (100 A). The installer will plan a device that slows charging when the house is busy, or ask the network operator about an upgrade. ${FUSE_CAUTION}`
    : `We don't know your main fuse rating yet, so we can't tell whether there is room for the charger. A clear photo of the cut-out (the sealed box where the supply cable comes in) usually shows it. ${FUSE_CAUTION}`;
  return {
    id: 'supply-headroom',
    light,
    title: 'Room on your supply for the charger',
    customerText,
    staffText: `Cut-out rating unknown. Assessed maximum demand ${formatNumber(demand.assessedDemandAmps, 2)} A (existing ${formatNumber(demand.existingDemandAmps, 2)} A after OSG Table A2 diversity + ${formatNumber(demand.chargerAmps, 2)} A charger, 722.311). Headroom at 60/80/100 A: ${[60, 80, 100].map((r) => formatNumber(r - demand.assessedDemandAmps, 2)).join(' / ')} A.`,
    figures: {
      assessedDemandAmps: demand.assessedDemandAmps,
      existingDemandAmps: demand.existingDemandAmps,
      chargerAmps: demand.chargerAmps,
      fuseAmps: null,
      headroomAmps: null,
      headroomByRating,
      marginAmps: settings.headroomMarginAmps,
      loadsDeclared: demand.loadsDeclared,
      items: demand.items,
    },
    source: SOURCE,
    actions: [
      'Send a clear photo of the cut-out showing its fuse rating (photos only; never open it).',
      ...(overEveryRating ? ['The installer to plan load limiting or a supply upgrade with the network operator.'] : []),
    ],
  };
}
