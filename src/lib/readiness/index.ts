// The readiness engine: runs every named check over a case's answers and uploads. Pure and
// client-safe, so the server stores the result and an island can show the same thing live.
import { checkCableReach } from './checks/cable-reach';
import { checkCableRun } from './checks/cable-run';
import { checkDocuments } from './checks/documents';
import { checkEarthing } from './checks/earthing';
import { checkNetworkOperator } from './checks/network-operator';
import { checkParking } from './checks/parking';
import { checkSupplyHeadroom } from './checks/supply-headroom';
import { checkSupplyIdentity } from './checks/supply-identity';
import { checkTiming } from './checks/timing';
import { isoDayNumber } from './dates';
import { worstLight } from './lights';
import { resolveReadinessSettings, type ReadinessSettingsInput } from './settings';
import type { Check, CheckId, CheckResult, ChecklistAnswers, Light, SiteMeasures, UploadSummary } from './types';

export * from './types';
export * from './plan';
export * from './settings';
export { worstLight, atLeast } from './lights';
export {
  assessMaximumDemand,
  cookerAllowanceAmps,
  lightingAllowanceAmps,
  loadQuestionKeys,
  loadsAllAnswered,
  showerAllowanceAmps,
  socketAllowanceAmps,
  type DemandAssessment,
  type DemandItem,
} from './demand';
export { chargerRating, chargerRatings, chargerRatingValues, knownPhases, type ChargerRating, type ChargerRatingKw } from './charger';
export { decideNetworkRoute, type NetworkRoute, type NetworkReason, type NetworkReasonCode, type NetworkRouteDecision } from './network-route';
export { CABLE_SIZES, cableTableSources, TABLE_4D4B_FROM_MEMORY, voltageDropVolts, voltageDropPercent, type CableSize } from './cable-tables';
export { cableDesign, cableSizeRows, capacityBasis, recommendedCsaMm2, type CableSizeRow, type CorrectionFactor } from './checks/cable-run';
export { earthingMeasureLabels, electrodeTest, type ElectrodeTest } from './checks/earthing';
export { requiredUploadKinds } from './checks/documents';
export { uploadKindLabels, uploadKindStatus, type UploadKindStatus, type UploadState } from './upload-status';
export { readinessCautions } from './cautions';
export {
  checkCableReach,
  checkCableRun,
  checkDocuments,
  checkEarthing,
  checkNetworkOperator,
  checkParking,
  checkSupplyHeadroom,
  checkSupplyIdentity,
  checkTiming,
};

/** Every check, in the order a reader meets them. Check ids are part of the API. */
export const readinessChecks: ReadonlyArray<{ id: CheckId; run: Check }> = Object.freeze([
  { id: 'supply-identity', run: checkSupplyIdentity },
  { id: 'supply-headroom', run: checkSupplyHeadroom },
  { id: 'network-operator', run: checkNetworkOperator },
  { id: 'earthing', run: checkEarthing },
  { id: 'cable-run', run: checkCableRun },
  { id: 'cable-reach', run: checkCableReach },
  { id: 'parking', run: checkParking },
  { id: 'timing', run: checkTiming },
  { id: 'documents', run: checkDocuments },
]);

export interface ReadinessInput {
  answers?: ChecklistAnswers | null;
  uploads?: readonly UploadSummary[] | null;
  /** What the office or surveyor recorded (measured demand, earthing measure, RA, IΔn). */
  site?: SiteMeasures | null;
  /** Partial settings are filled in with the defaults. */
  settings?: ReadinessSettingsInput | null;
  /** Today's date, YYYY-MM-DD. */
  today: string;
}

export interface ReadinessResult {
  /** The worst light of all the checks. */
  light: Light;
  /** How many checks are not green (amber or red): the case's open gaps. */
  gapCount: number;
  checks: CheckResult[];
}

/**
 * Runs every check and rates the case by the worst of them.
 *
 * @example runChecks({ answers: {}, uploads: [], today: '2025-01-01' }).light // 'amber' (nothing answered yet: gaps, no blockers)
 */
export function runChecks(input: ReadinessInput): ReadinessResult {
  if (isoDayNumber(input.today) === null) throw new RangeError(`today must be a YYYY-MM-DD date, not ${input.today}`);
  const checkInput = {
    answers: input.answers ?? {},
    uploads: input.uploads ?? [],
    site: input.site ?? {},
    settings: resolveReadinessSettings(input.settings),
    today: input.today,
  };
  const checks = readinessChecks.map((check) => check.run(checkInput));
  return {
    light: worstLight(checks.map((check) => check.light)),
    gapCount: checks.filter((check) => check.light !== 'green').length,
    checks,
  };
}
