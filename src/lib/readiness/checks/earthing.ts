// Earthing: whether an outdoor charge point on PME (or unknown) earthing needs an earth
// electrode or an open-PEN device, and whether open soil near the charge point makes an
// electrode practical.
import { COMMON_PRACTICE, type ReadinessSettings } from '../settings';
import type { CheckInput, CheckResult, Earthing, Light } from '../types';
import { formatNumber } from '../units';

const SOURCE = `BS 7671:2018+A2:2022 Regulation 722.411.4.1 (PME and outdoor charging points); 411.5.3 and Table 41.5 Note 2 (TT electrode); 722.531.3.101 (RCD); soft ground near the charge point: ${COMMON_PRACTICE}`;
const TITLE = 'Earthing for an outdoor charger';
const RCD_NOTE =
  'RCD: the charging point needs its own 30 mA RCD, at least Type A; Type B, or Type A/F with an RDC-DD to BS IEC 62955, where DC fault current over 6 mA is possible (722.531.3.101).';
const PME_RULE =
  '722.411.4.1: a PME earthing facility is not to be used for an outdoor charging point unless a listed measure applies — an installation earth electrode keeping the earth voltage ≤ 70 V on a broken PEN, or a device disconnecting live and protective conductors within 5 s above 70 V rms (check the current amendment for the voltage-monitoring option).';
const COVERS_CAUTION = "Please don't remove any covers to look: photos are all we need.";

/** RA × IΔn ≤ 50 V (BS 7671 411.5.3): the largest RA for a 30 mA RCD. */
export const TT_MAX_RA_OHMS_30MA = 50 / 0.03;
/** Above this an electrode resistance may not be stable (BS 7671 Table 41.5, Note 2). */
export const TT_STABLE_RA_OHMS = 200;

export type ElectrodeGround = 'near' | 'far' | 'distance-unknown' | 'none' | 'unknown';

/**
 * How practical an earth electrode is, from the customer's soft-ground answers.
 *
 * @example electrodeGround(true, 4, 10) // 'near'
 */
export function electrodeGround(
  softGround: boolean | null | undefined,
  softGroundMetres: number | null | undefined,
  nearMetres: number,
): ElectrodeGround {
  if (softGround === false) return 'none';
  if (softGround !== true) return 'unknown';
  if (typeof softGroundMetres !== 'number' || !Number.isFinite(softGroundMetres) || softGroundMetres < 0) {
    return 'distance-unknown';
  }
  return softGroundMetres <= nearMetres ? 'near' : 'far';
}

/**
 * TN-S and TT are green; PME is green only with open soil near the charge point; otherwise amber.
 *
 * @example checkEarthing({ answers: { supply: { earthing: 'pme' }, charger: { softGround: true, softGroundMetres: 3 } }, uploads: [], settings: defaultReadinessSettings, today: '2025-01-01' }).light
 * // 'green'
 */
export function checkEarthing({ answers, settings }: CheckInput): CheckResult {
  const earthing: Earthing = answers.supply?.earthing ?? 'unknown';
  const charger = answers.charger ?? {};
  const ground = electrodeGround(charger.softGround, charger.softGroundMetres, settings.nearSoftGroundMetres);
  const outdoorUse = answers.parking?.kind === 'garage' ? 'possibly' : 'yes';
  const measureNeeded = earthing === 'pme' || earthing === 'unknown';
  const light = earthingLight(earthing, ground);
  return {
    id: 'earthing',
    light,
    title: TITLE,
    customerText: customerText(earthing, ground, charger.softGroundMetres, settings),
    staffText: staffText(earthing, ground, charger.softGroundMetres, outdoorUse, settings),
    figures: {
      earthing,
      outdoorUse,
      measureNeeded,
      softGround: charger.softGround ?? null,
      softGroundMetres: charger.softGroundMetres ?? null,
      nearThresholdMetres: settings.nearSoftGroundMetres,
      electrodeGround: ground,
      ttMaxRaOhms: earthing === 'tt' ? Math.round(TT_MAX_RA_OHMS_30MA) : null,
      ttStableRaOhms: earthing === 'tt' ? TT_STABLE_RA_OHMS : null,
    },
    source: SOURCE,
    actions: light === 'green' ? [] : actions(earthing, ground),
  };
}

/**
 * The light for an earthing type and the ground near the charge point.
 *
 * @example earthingLight('pme', 'none') // 'amber' (an open-PEN device is still to be settled)
 */
export function earthingLight(earthing: Earthing, ground: ElectrodeGround): Light {
  if (earthing === 'tns' || earthing === 'tt') return 'green';
  if (earthing === 'pme' && ground === 'near') return 'green';
  return 'amber';
}

function groundText(ground: ElectrodeGround, metres: number | null | undefined, settings: ReadinessSettings): string {
  switch (ground) {
    case 'near':
      return `The open ground about ${formatNumber(metres ?? 0)} m from the charge point means an earth rod could go in there.`;
    case 'far':
      return `The open ground is about ${formatNumber(metres ?? 0)} m away, further than the ${settings.nearSoftGroundMetres} m we count as near, so a charger with built-in protection may suit better.`;
    case 'distance-unknown':
      return 'You mentioned open ground nearby: please tell us roughly how far it is from the charge point.';
    case 'none':
      return 'With no open ground nearby, the installer will most likely use a charger with built-in protection.';
    case 'unknown':
      return 'Please tell us whether there is open soil (a lawn or flower bed) near the charge point.';
  }
}

function customerText(
  earthing: Earthing,
  ground: ElectrodeGround,
  metres: number | null | undefined,
  settings: ReadinessSettings,
): string {
  if (earthing === 'tns') return 'Your home has a type of earthing that suits an outdoor charger without extra measures. The surveyor will confirm it.';
  if (earthing === 'tt') return 'Your home already has its own earth rod. The installer will test it on the day.';
  const intro =
    earthing === 'pme'
      ? 'Your home has the most common type of earthing (PME), which needs one extra safety measure for an outdoor charger: an earth rod in open ground, or a charger with built-in protection.'
      : "We don't know how your home is earthed yet. Most homes have a type (PME) that needs one extra safety measure for an outdoor charger: an earth rod in open ground, or a charger with built-in protection. The surveyor will check.";
  return `${intro} ${groundText(ground, metres, settings)} ${COVERS_CAUTION}`;
}

function staffText(
  earthing: Earthing,
  ground: ElectrodeGround,
  metres: number | null | undefined,
  outdoorUse: 'yes' | 'possibly',
  settings: ReadinessSettings,
): string {
  const where = outdoorUse === 'possibly' ? ' Garage parking: the rule applies if the vehicle may be charged outdoors — confirm at survey.' : '';
  if (earthing === 'tns') return `TN-S: the 722.411.4.1 PME restriction does not apply; confirm the earthing at survey. ${RCD_NOTE}`;
  if (earthing === 'tt') {
    return `TT: an installation earth electrode exists. Test RA: RA × IΔn ≤ 50 V (411.5.3), i.e. RA ≤ ${Math.round(TT_MAX_RA_OHMS_30MA)} Ω with a 30 mA RCD; above ${TT_STABLE_RA_OHMS} Ω may not be stable (Table 41.5 Note 2). ${RCD_NOTE}`;
  }
  const type = earthing === 'pme' ? 'PME (TN-C-S)' : 'Earthing unknown — treat as PME until seen';
  const soil: Record<ElectrodeGround, string> = {
    near: `Soft ground ${formatNumber(metres ?? 0)} m from the CP (≤ ${settings.nearSoftGroundMetres} m): electrode practical.`,
    far: `Soft ground ${formatNumber(metres ?? 0)} m from the CP (> ${settings.nearSoftGroundMetres} m): long electrode cable; consider an open-PEN device.`,
    'distance-unknown': 'Soft ground reported, distance not given.',
    none: 'No soft ground: open-PEN device likely.',
    unknown: 'Soft ground not answered.',
  };
  return `${type}. ${PME_RULE} ${soil[ground]}${where} ${RCD_NOTE}`;
}

function actions(earthing: Earthing, ground: ElectrodeGround): string[] {
  const list: string[] = [];
  if (earthing === 'unknown') {
    list.push('Send a clear photo of the cut-out and the earth cable beside the meter so the earthing type can be seen (photos only).');
  }
  if (ground === 'unknown') list.push('Tell us whether there is open soil near the charge point, and roughly how far away.');
  if (ground === 'distance-unknown') list.push('Tell us roughly how far the open soil is from the charge point.');
  if (ground === 'far' || ground === 'none') {
    list.push('The installer to plan an open-PEN protective device (or a charger with one built in).');
  }
  return list;
}
