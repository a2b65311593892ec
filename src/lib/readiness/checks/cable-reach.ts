// Cable reach: whether the charging cable reaches the car's charge port in every way the
// car is parked, measured on the customer's driveway plan.
import { withArticle } from '@/lib/grammar';
import { carSize, otherBaysOccupied, readPlan, reachVerdict, type ReachVerdict } from '@/lib/readiness/plan';
import { COMMON_PRACTICE, type ReadinessSettings } from '@/lib/readiness/settings';
import type { ChargePort, ChargerAnswers, CheckInput, CheckResult, ParkingHabit } from '@/lib/readiness/types';
import { formatNumber, positiveOrNull } from '@/lib/readiness/units';
import { optionWords } from '@/lib/vocabulary/fields';
import { cableSourceWords } from '@/lib/vocabulary/pack';
import { portLabels, portStaffLabels, wayLabels, wayPhrases } from '@/lib/vocabulary/plan';
import { checkTitles } from '../check-titles';

// The car sizes behind the sketch are from memory (see plan.ts); staff read only "common practice".
const SOURCE = `Geometry of the customer's driveway plan; tethered cable commonly about 5 m (IEC 62196-2 connectors; ${COMMON_PRACTICE}); slack allowance and car sizes: ${COMMON_PRACTICE}`;
const TITLE = checkTitles['cable-reach'];

export type CableSource = 'tether' | 'tether-assumed' | 'customer-cable-assumed';

/**
 * The cable length to test: a tethered unit's own cable (or the usual 5 m if not given), or
 * for a socketed unit the customer's own cable (assumed from settings).
 *
 * @example cableForReach({ preference: 'tethered', tetherMetres: 7.5 }, defaultReadinessSettings) // { metres: 7.5, source: 'tether' }
 */
export function cableForReach(charger: ChargerAnswers, settings: ReadinessSettings): { metres: number; source: CableSource } {
  if (charger.preference === 'socketed') return { metres: settings.defaultCustomerCableMetres, source: 'customer-cable-assumed' };
  const tether = positiveOrNull(charger.tetherMetres);
  return tether === null ? { metres: settings.defaultTetherMetres, source: 'tether-assumed' } : { metres: tether, source: 'tether' };
}

/**
 * Green when every required way reaches; amber otherwise, or with no plan or no port. Never
 * red: a longer cable, another spot or parking the other way fixes it without blocking the job.
 *
 * @example checkCableReach({ answers: { charger: {} }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).actions
 * // ['Draw your driveway plan in the charge point step.']
 */
export function checkCableReach({ answers, settings }: CheckInput): CheckResult {
  const charger = answers.charger ?? {};
  const habit: ParkingHabit = answers.parking?.habit ?? 'varies';
  const cable = cableForReach(charger, settings);
  if (!charger.plan) return gapResult('No driveway plan yet.', 'Draw your driveway plan in the charge point step.', cable);
  // The plan arrives as saved JSON: read it through its schema before measuring anything.
  const { plan, problems } = readPlan(charger.plan);
  if (!plan) return gapResult(`Plan incomplete: ${problems.join(' ')}`, problems[0] as string, cable);
  const port = plan.chargePort ?? answers.vehicle?.chargePort ?? null;
  if (!port) return gapResult('Charge port position not given.', "Tell us where the charging socket is on your car.", cable);
  // Another car in the other bay is an obstacle unless the customer said there is only one car.
  const cars = answers.parking?.cars;
  const othersParked = otherBaysOccupied(cars);
  const verdicts = reachVerdict(plan, cable.metres, habit, {
    port,
    slackMetres: settings.cableSlackMetres,
    portInsetMetres: settings.portInsetMetres,
    otherBaysOccupied: othersParked,
  });
  const allReach = verdicts.every((v) => v.reaches);
  return {
    id: 'cable-reach',
    light: allReach ? 'green' : 'amber',
    title: TITLE,
    customerText: customerText(verdicts, cable, port),
    staffText: staffText(verdicts, cable, port, habit, settings),
    figures: {
      cableMetres: cable.metres,
      cableSource: cable.source,
      port,
      portSource: plan.chargePort ? 'plan' : 'vehicle',
      habit,
      car: carSize(plan.car),
      slackMetres: settings.cableSlackMetres,
      bays: plan.bays.length,
      otherBaysOccupied: plan.bays.length > 1 ? othersParked : null,
      verdicts,
    },
    source: SOURCE,
    actions: allReach ? [] : ['Park the other way, choose a longer cable, or move the charge point closer to the port.'],
  };
}

function cableWords(cable: { metres: number; source: CableSource }): string {
  if (cable.source === 'customer-cable-assumed') return `your own charging cable (we've assumed ${formatNumber(cable.metres)} m)`;
  if (cable.source === 'tether-assumed') return `${withArticle(`${formatNumber(cable.metres)} m tethered cable`)} (the usual length)`;
  return `the ${formatNumber(cable.metres)} m tethered cable`;
}

function customerText(verdicts: readonly ReachVerdict[], cable: { metres: number; source: CableSource }, port: ChargePort): string {
  const failing = verdicts.filter((v) => !v.reaches);
  const subject = `With ${cableWords(cable)} and the charging socket on the car at ${portLabels[port].toLowerCase()}`;
  if (failing.length === 0) return `${subject}, the cable reaches your car however you park it. Good news.`;
  const worst = failing.reduce((a, b) => (b.requiredMetres > a.requiredMetres ? b : a));
  const ways = [...new Set(failing.map((v) => wayPhrases[v.way]))].join(' or ');
  return `${subject}, the cable won't quite reach when you ${ways} — it would need about ${formatNumber(worst.requiredMetres)} m. Parking the other way, a longer cable or moving the charge point a little would sort it.`;
}

function staffText(
  verdicts: readonly ReachVerdict[],
  cable: { metres: number; source: CableSource },
  port: ChargePort,
  habit: ParkingHabit,
  settings: ReadinessSettings,
): string {
  const lines = verdicts.map(
    (v) => `bay ${v.bayIndex + 1} ${wayLabels[v.way].toLowerCase()}: ${formatNumber(v.requiredMetres, 2)} m needed (${formatNumber(v.planMetres, 2)} m on plan + ${settings.cableSlackMetres} m slack) — ${v.reaches ? 'reaches' : `short by ${formatNumber(v.shortByMetres, 2)} m`}`,
  );
  return `Cable ${formatNumber(cable.metres, 2)} m (${cableSourceWords[cable.source]}), port ${portStaffLabels[port].toLowerCase()}, parked ${(optionWords('parking.habit', String(habit), 'staff') ?? String(habit)).toLowerCase()}: ${lines.join('; ')}.`;
}

function gapResult(staffText: string, action: string, cable: { metres: number; source: CableSource }): CheckResult {
  return {
    id: 'cable-reach',
    light: 'amber',
    title: TITLE,
    customerText: `To check that the charging cable will reach your car, we need a little more: ${action.charAt(0).toLowerCase()}${action.slice(1)}`,
    staffText: `${staffText} Reach not computed.`,
    figures: { cableMetres: cable.metres, cableSource: cable.source, verdicts: [] },
    source: SOURCE,
    actions: [action],
  };
}
