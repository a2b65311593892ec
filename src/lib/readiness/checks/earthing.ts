// Earthing: whether an outdoor charge point on PME (or unknown) earthing needs an earth
// electrode or an open-PEN device, and whether open soil near the charge point makes an
// electrode practical.
import { COMMON_PRACTICE, type ReadinessSettings } from '@/lib/readiness/settings';
import type { CheckInput, CheckResult, Earthing, EarthingMeasure, Light } from '@/lib/readiness/types';
import { formatNumber } from '@/lib/readiness/units';
import { checkTitles } from '../check-titles';

const SOURCE = `BS 7671:2018+A2:2022 Regulation 722.411.4.1 (PME and outdoor charging points); 411.5.3 (RA × IΔn ≤ 50 V); Table 41.5 Note 2 (above 200 Ω may not be stable; ${COMMON_PRACTICE} as applied here); 722.531.3.101 (RCD); soft ground near the charge point: ${COMMON_PRACTICE}`;
const TITLE = checkTitles['earthing'];
const RCD_NOTE =
  'RCD: the charging point needs its own 30 mA RCD, at least Type A; Type B, or Type A/F with an RDC-DD to BS IEC 62955, where DC fault current over 6 mA is possible (722.531.3.101).';
const PME_RULE =
  '722.411.4.1: a PME earthing facility is not to be used for an outdoor charging point unless a listed measure applies — an installation earth electrode keeping the earth voltage ≤ 70 V on a broken PEN, or a device disconnecting live and protective conductors within 5 s above 70 V rms (check the current amendment for the voltage-monitoring option).';
const COVERS_CAUTION = "Please don't remove any covers to look: photos are all we need.";

/** Above this an electrode resistance may not be stable (BS 7671 Table 41.5, Note 2; common practice). */
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

/** The 722.411.4.1 measures in staff words, for the figures, the pack and the outcome form. */
export const earthingMeasureLabels: Readonly<Record<EarthingMeasure, string>> = Object.freeze({
  'open-pen-device': 'Charge point (or device) with open-PEN detection: disconnects live and protective conductors within 5 s above 70 V rms',
  'tt-electrode': 'Charging point made part of a TT system with its own earth electrode',
  'installation-electrode': 'Installation earth electrode keeping the earth voltage at or below 70 V if the PEN conductor breaks',
  'balanced-three-phase': 'Balanced three-phase installation',
  'other-listed': 'Another measure listed in 722.411.4.1 (e.g. the voltage-monitoring option of the current amendment)',
});

/** The electrode test against 411.5.3 and the stability note, once RA and IΔn are recorded. */
export interface ElectrodeTest {
  raOhms: number | null;
  idnMilliamps: number | null;
  /** RA × IΔn, volts; null until both are recorded. */
  touchVolts: number | null;
  passes: boolean | null;
  /** RA above 200 Ω: may not be stable. */
  possiblyUnstable: boolean | null;
}

/**
 * RA × IΔn ≤ 50 V (BS 7671 411.5.3); RA above 200 Ω may not be stable (Table 41.5 Note 2, as
 * the trade reference notes; treated here as common practice).
 *
 * @example electrodeTest(250, 30) // { touchVolts: 7.5, passes: true, possiblyUnstable: true, … }
 */
export function electrodeTest(raOhms: number | null | undefined, idnMilliamps: number | null | undefined): ElectrodeTest {
  const ra = typeof raOhms === 'number' && Number.isFinite(raOhms) && raOhms >= 0 ? raOhms : null;
  const idn = typeof idnMilliamps === 'number' && Number.isFinite(idnMilliamps) && idnMilliamps > 0 ? idnMilliamps : null;
  const touchVolts = ra !== null && idn !== null ? Math.round(ra * idn) / 1000 : null;
  return {
    raOhms: ra,
    idnMilliamps: idn,
    touchVolts,
    passes: touchVolts === null ? null : touchVolts <= TT_TOUCH_VOLTS,
    possiblyUnstable: ra === null ? null : ra > TT_STABLE_RA_OHMS,
  };
}

/** The touch-voltage limit of 411.5.3. */
export const TT_TOUCH_VOLTS = 50;

/**
 * TN-S is green. TT needs RA and IΔn recorded and passing 411.5.3 (red when it fails, amber above
 * 200 Ω). PME or unknown earthing stays amber until staff record a 722.411.4.1 measure; soft
 * ground only says whether an electrode is practical.
 *
 * @example checkEarthing({ answers: { supply: { earthing: 'pme' }, charger: { softGround: true, softGroundMetres: 3 } }, uploads: [], site: {}, settings: defaultReadinessSettings, today: '2025-01-01' }).light
 * // 'amber' (no measure recorded yet)
 */
export function checkEarthing({ answers, site, settings }: CheckInput): CheckResult {
  const earthing: Earthing = answers.supply?.earthing ?? 'unknown';
  const charger = answers.charger ?? {};
  const ground = electrodeGround(charger.softGround, charger.softGroundMetres, settings.nearSoftGroundMetres);
  const outdoorUse = answers.parking?.kind === 'garage' ? 'possibly' : 'yes';
  const measureNeeded = earthing === 'pme' || earthing === 'unknown';
  const measure = measureNeeded ? (site.earthingMeasure ?? null) : null;
  const test = electrodeTest(site.electrodeOhms, site.rcdIdnMilliamps);
  const needsTest = earthing === 'tt' || measure === 'tt-electrode';
  const threePhase = answers.supply?.phases === 'three';
  const light = earthingLight(earthing, measure, needsTest ? test : null, threePhase);
  return {
    id: 'earthing',
    light,
    title: TITLE,
    customerText: customerText(earthing, ground, charger.softGroundMetres, settings, measure, needsTest ? test : null),
    staffText: staffText(earthing, ground, charger.softGroundMetres, outdoorUse, settings, measure, needsTest ? test : null, threePhase),
    figures: {
      earthing,
      outdoorUse,
      measureNeeded,
      earthingMeasure: measure,
      earthingMeasureLabel: measure ? earthingMeasureLabels[measure] : null,
      softGround: charger.softGround ?? null,
      softGroundMetres: charger.softGroundMetres ?? null,
      nearThresholdMetres: settings.nearSoftGroundMetres,
      electrodeGround: ground,
      electrodeTest: needsTest ? test : null,
      ttMaxRaOhms: needsTest ? Math.round(TT_TOUCH_VOLTS / ((test.idnMilliamps ?? 30) / 1000)) : null,
      ttStableRaOhms: needsTest ? TT_STABLE_RA_OHMS : null,
    },
    source: SOURCE,
    actions: light === 'green' ? [] : actions(earthing, ground, measure, needsTest ? test : null, threePhase),
  };
}

/**
 * The light for an earthing type, the recorded measure and any electrode test.
 *
 * @example earthingLight('pme', null, null, false) // 'amber' (no 722.411.4.1 measure recorded)
 */
export function earthingLight(earthing: Earthing, measure: EarthingMeasure | null, test: ElectrodeTest | null, threePhase: boolean): Light {
  if (earthing === 'tns') return 'green';
  if (test) {
    if (test.passes === false) return 'red';
    if (test.passes === null || test.possiblyUnstable) return 'amber';
  }
  if (earthing === 'tt') return 'green';
  if (measure === null) return 'amber';
  if (measure === 'balanced-three-phase' && !threePhase) return 'amber';
  return 'green';
}

function groundText(ground: ElectrodeGround, metres: number | null | undefined, settings: ReadinessSettings): string {
  switch (ground) {
    case 'near':
      return `The open ground about ${formatNumber(metres ?? 0)} m from the charge point means an earth rod could go in there.`;
    case 'far':
      return `The open ground is about ${formatNumber(metres ?? 0)} m away, further than the ${settings.nearSoftGroundMetres} m we count as near, so a charge point with built-in protection may suit better.`;
    case 'distance-unknown':
      return 'You mentioned open ground nearby: please tell us roughly how far it is from the charge point.';
    case 'none':
      return 'With no open ground nearby, your installer will most likely use a charge point with built-in protection.';
    case 'unknown':
      return 'Please tell us whether there is open soil (a lawn or flower bed) near the charge point.';
  }
}

function testWords(test: ElectrodeTest): string {
  if (test.touchVolts === null) return 'RA and IΔn not recorded yet.';
  const verdict = test.passes ? '≤ 50 V: passes 411.5.3' : '> 50 V: fails 411.5.3';
  const stable = test.possiblyUnstable ? ` RA above ${TT_STABLE_RA_OHMS} Ω may not be stable (Table 41.5 Note 2; common practice).` : '';
  return `RA ${test.raOhms} Ω × IΔn ${test.idnMilliamps} mA = ${test.touchVolts} V ${verdict}.${stable}`;
}

function customerText(
  earthing: Earthing,
  ground: ElectrodeGround,
  metres: number | null | undefined,
  settings: ReadinessSettings,
  measure: EarthingMeasure | null,
  test: ElectrodeTest | null,
): string {
  if (earthing === 'tns') return 'Your home has a type of earthing that suits an outdoor charge point without extra measures. Your installer will confirm it.';
  if (test?.passes === false) return 'The earth rod tested did not give a low enough reading for the safety switch that protects it. Your installer will improve the earth rod or change the protection before the charge point is used.';
  if (test?.possiblyUnstable) return 'The earth rod works, but its reading is high enough that it may change with the weather. Your installer may add to it or check it again.';
  if (earthing === 'tt') {
    return test?.passes ? 'Your home has its own earth rod, and it tested well.' : 'Your home already has its own earth rod. Your installer will test it on the day.';
  }
  if (measure) return 'Your installer has chosen the extra safety measure your earthing needs for an outdoor charge point.';
  const intro =
    earthing === 'pme'
      ? 'Your home has the most common type of earthing (PME), which needs one extra safety measure for an outdoor charge point: an earth rod in open ground, or a charge point with built-in protection. Your installer will choose which.'
      : "We don't know how your home is earthed yet. Most homes have a type (PME) that needs one extra safety measure for an outdoor charge point: an earth rod in open ground, or a charge point with built-in protection. Your installer will check.";
  return `${intro} ${groundText(ground, metres, settings)} ${COVERS_CAUTION}`;
}

function staffText(
  earthing: Earthing,
  ground: ElectrodeGround,
  metres: number | null | undefined,
  outdoorUse: 'yes' | 'possibly',
  settings: ReadinessSettings,
  measure: EarthingMeasure | null,
  test: ElectrodeTest | null,
  threePhase: boolean,
): string {
  const where = outdoorUse === 'possibly' ? ' Garage parking: the rule applies if the vehicle may be charged outdoors — confirm at survey.' : '';
  if (earthing === 'tns') return `TN-S: the 722.411.4.1 PME restriction does not apply; confirm the earthing at survey. ${RCD_NOTE}`;
  if (earthing === 'tt') return `TT: installation earth electrode. ${testWords(test ?? electrodeTest(null, null))} ${RCD_NOTE}`;
  const type = earthing === 'pme' ? 'PME (TN-C-S)' : 'Earthing unknown — treat as PME until seen';
  const soil: Record<ElectrodeGround, string> = {
    near: `Soft ground ${formatNumber(metres ?? 0)} m from the CP (≤ ${settings.nearSoftGroundMetres} m): an electrode is practical.`,
    far: `Soft ground ${formatNumber(metres ?? 0)} m from the CP (> ${settings.nearSoftGroundMetres} m): long electrode cable; an open-PEN device may suit better.`,
    'distance-unknown': 'Soft ground reported, distance not given.',
    none: 'No soft ground: an open-PEN device is likely.',
    unknown: 'Soft ground not answered.',
  };
  const chosen = measure
    ? `Measure recorded: ${earthingMeasureLabels[measure]}.${measure === 'balanced-three-phase' && !threePhase ? ' The supply is not recorded as three phase: check.' : ''}${test ? ` ${testWords(test)}` : ''}`
    : 'No 722.411.4.1 measure recorded yet: the office or surveyor records which one will be used.';
  return `${type}. ${PME_RULE} ${chosen} ${soil[ground]}${where} ${RCD_NOTE}`;
}

function actions(earthing: Earthing, ground: ElectrodeGround, measure: EarthingMeasure | null, test: ElectrodeTest | null, threePhase: boolean): string[] {
  const list: string[] = [];
  if (earthing === 'unknown') {
    list.push('Send a clear photo of the cut-out and the earth cable beside the meter so the earthing type can be seen (photos only).');
  }
  if (test?.passes === false) list.push('Improve the electrode (or the RCD) until RA × IΔn ≤ 50 V (411.5.3).');
  else if (test?.possiblyUnstable) list.push(`Consider improving the electrode: RA above ${TT_STABLE_RA_OHMS} Ω may not be stable.`);
  else if (test && test.touchVolts === null) list.push('The surveyor to record the electrode resistance RA and the RCD’s IΔn.');
  if ((earthing === 'pme' || earthing === 'unknown') && measure === null) {
    list.push('The office or surveyor to record the 722.411.4.1 measure (open-PEN device, TT electrode, or another listed option).');
    if (ground === 'unknown') list.push('Tell us whether there is open soil near the charge point, and roughly how far away.');
    if (ground === 'distance-unknown') list.push('Tell us roughly how far the open soil is from the charge point.');
  }
  if (measure === 'balanced-three-phase' && !threePhase) list.push('Confirm the supply is three phase, or record another measure.');
  return list;
}
