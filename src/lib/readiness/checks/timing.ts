// Timing: can the survey, the install and any network-operator step fit before the car arrives?
import { countOf } from '@/lib/grammar';
import { addDays, isoDayNumber } from '@/lib/readiness/dates';
import { decideNetworkRoute, ENA_SOURCE, networkRouteNames } from '@/lib/readiness/network-route';
import { COMMON_PRACTICE, type ReadinessSettings } from '@/lib/readiness/settings';
import type { CheckInput, CheckResult, Light } from '@/lib/readiness/types';
import { checkTitles } from '../check-titles';

const SOURCE = `Lead times from settings (${COMMON_PRACTICE}); network operator step: ${ENA_SOURCE}`;
const TITLE = checkTitles['timing'];

export interface LeadTime {
  surveyLeadDays: number;
  installLeadDays: number;
  supplyUpgradeLeadDays: number;
  totalLeadDays: number;
}

/**
 * Calendar days from today to the earliest install: survey + install, plus the supply-upgrade
 * lead time when the network operator must be applied to first. Weekends are not skipped.
 *
 * @example leadTime(defaultReadinessSettings, true).totalLeadDays // 7 + 14 + 28 = 49
 */
export function leadTime(settings: ReadinessSettings, applyBefore: boolean): LeadTime {
  const supplyUpgradeLeadDays = applyBefore ? settings.supplyUpgradeLeadDays : 0;
  return {
    surveyLeadDays: settings.surveyLeadDays,
    installLeadDays: settings.installLeadDays,
    supplyUpgradeLeadDays,
    totalLeadDays: settings.surveyLeadDays + settings.installLeadDays + supplyUpgradeLeadDays,
  };
}

/**
 * The light for the spare days between the earliest install and delivery: negative is red,
 * fewer than the slack is amber, otherwise green.
 *
 * @example timingLight(0, 7) // 'amber' (install on the delivery day itself)
 */
export function timingLight(spareDays: number, slackDays: number): Light {
  if (spareDays < 0) return 'red';
  return spareDays < slackDays ? 'amber' : 'green';
}

/**
 * Compares the delivery date with today plus the lead times. A missing date is amber; a car
 * already delivered (date today or earlier) is amber "as soon as possible" — nothing can be
 * rescheduled any more, so it is not a blocker.
 *
 * @example checkTiming({ answers: { vehicle: { deliveryDate: '2025-03-01' }, supply: { mainFuseAmps: 100, looped: 'no', loads: {} } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).light
 * // 'green' (59 days to delivery, 21 days lead, 38 spare)
 */
export function checkTiming({ answers, site, settings, today }: CheckInput): CheckResult {
  const todayDay = isoDayNumber(today);
  if (todayDay === null) throw new RangeError(`today must be a YYYY-MM-DD date, not ${today}`);
  const route = decideNetworkRoute(answers, site, settings);
  // The lead time that is known, and the longest it could be while answers are missing.
  const known = leadTime(settings, route.applyBeforeKnown);
  const lead = leadTime(settings, route.route === 'apply-before');
  const earliestInstallDate = addDays(today, lead.totalLeadDays);
  const deliveryDate = answers.vehicle?.deliveryDate ?? null;
  const deliveryDay = isoDayNumber(deliveryDate);
  const networkLeadKnown = route.applyBeforeKnown || route.route === 'notify-after';
  const base = { today, deliveryDate, ...lead, knownLeadDays: known.totalLeadDays, networkLeadKnown, networkRoute: route.route, earliestInstallDate, slackDays: settings.timingSlackDays };
  if (deliveryDay === null) {
    return result('amber', 'Please tell us when you expect the car, so we can plan the survey and install in time.', `Delivery date ${deliveryDate ? `"${deliveryDate}" is not a date` : 'not given'}. Earliest install ${earliestInstallDate} (${lead.totalLeadDays} days).`, { ...base, daysUntilDelivery: null, spareDays: null, knownSpareDays: null }, ['Enter the expected delivery date.']);
  }
  const daysUntilDelivery = deliveryDay - todayDay;
  const spareDays = daysUntilDelivery - lead.totalLeadDays;
  const knownSpareDays = daysUntilDelivery - known.totalLeadDays;
  const figures = { ...base, daysUntilDelivery, spareDays, knownSpareDays };
  if (daysUntilDelivery <= 0) {
    return result('amber', "Your car is already with you (or arrives today), so we'll get the charge point fitted as soon as we can. In the meantime, please follow the car maker's advice on charging.", `Car delivered or due today (${deliveryDate}); earliest install ${earliestInstallDate}. Book as soon as possible.`, figures, ['Book the survey as soon as possible.']);
  }
  const light = timingLightWithUnknowns(spareDays, knownSpareDays, settings.timingSlackDays);
  const pending = !networkLeadKnown && light !== 'green';
  return result(light, customerText(light, spareDays, route.route === 'apply-before', pending), staffText(figures, settings, networkLeadKnown), figures, actions(light, pending));
}

/**
 * Red only when the known lead time alone overruns delivery; an overrun that depends on a
 * missing answer (for example an unknown looped supply) is amber.
 *
 * @example timingLightWithUnknowns(-19, 9, 7) // 'amber': 30 days, 21 known + 28 possible
 */
export function timingLightWithUnknowns(worstSpareDays: number, knownSpareDays: number, slackDays: number): Light {
  if (knownSpareDays < 0) return 'red';
  const worst = timingLight(worstSpareDays, slackDays);
  return worst === 'red' ? 'amber' : worst;
}

function customerText(light: Light, spareDays: number, applyBefore: boolean, pending: boolean): string {
  const network = applyBefore ? ', including the time your network operator needs,' : '';
  if (pending) return `If your network operator has to approve the charge point first, the survey and install may not fit before your car arrives. A few answers about your supply will tell us: please send them soon.`;
  if (light === 'green') return `There is time to survey and fit the charge point${network} before your car arrives, with about ${countOf(spareDays, 'day')} to spare.`;
  if (light === 'amber') return `The survey and install${network} should just fit before your car arrives, with only ${countOf(spareDays, 'day')} to spare. Sending the rest of your answers soon helps.`;
  return `The survey and install${network} will probably take longer than the time before your car arrives — about ${countOf(-spareDays, 'day')} too long. We'll do all we can; please send the rest of your answers as soon as possible.`;
}

function staffText(figures: { daysUntilDelivery: number; totalLeadDays: number; spareDays: number; knownSpareDays: number; earliestInstallDate: string; supplyUpgradeLeadDays: number; deliveryDate: string | null }, settings: ReadinessSettings, networkLeadKnown: boolean): string {
  const upgrade = figures.supplyUpgradeLeadDays > 0 ? ` + ${figures.supplyUpgradeLeadDays} DNO (${networkRouteNames['apply-before']}${networkLeadKnown ? '' : ', possible: answers missing'})` : '';
  const known = networkLeadKnown ? '' : ` Without the possible DNO step: spare ${figures.knownSpareDays} days.`;
  return `Delivery ${figures.deliveryDate} in ${figures.daysUntilDelivery} days; lead ${figures.totalLeadDays} days (${settings.surveyLeadDays} survey + ${settings.installLeadDays} install${upgrade}, calendar days); earliest install ${figures.earliestInstallDate}; spare ${figures.spareDays} days (slack ${settings.timingSlackDays}).${known}`;
}

function actions(light: Light, pending: boolean): string[] {
  if (light === 'green') return [];
  if (pending) return ['Settle the supply answers (looped supply, main fuse, loads) so the network operator step is known.'];
  if (light === 'amber') return ['Send the remaining answers promptly so the survey can be booked without delay.'];
  return ['Book the survey at the earliest slot, and start any network operator application now.'];
}

function result(light: Light, customerText: string, staffText: string, figures: Record<string, unknown>, actions: string[]): CheckResult {
  return { id: 'timing', light, title: TITLE, customerText, staffText, figures, source: SOURCE, actions };
}
