// Server-only: the JSON shape of one case as the API and pages hand it out.
import type { CaseRow } from '../../db/schema';
import { fieldWarnings, sectionProgress, type Checklist } from '../schemas/checklist';
import { checkMpanCore } from '../validation/mpan';
import type { CheckResult } from '../readiness';
import { readSiteMeasures } from '../schemas/outcome';

/** Stages in which the customer may still change their answers. */
export const editableStages: CaseRow['stage'][] = ['invited', 'filling_in', 'sent_for_review', 'in_review', 'ready_for_survey'];

export type CaseView = ReturnType<typeof toCaseView>;

/** The case as its customer and staff see it through the API. */
export function toCaseView(row: CaseRow) {
  const checklist = (row.checklist ?? {}) as Checklist;
  const mpan = checklist.supply?.mpanCore ? checkMpanCore(checklist.supply.mpanCore) : null;
  return {
    id: row.id,
    reference: row.reference,
    stage: row.stage,
    version: row.version,
    checklist,
    progress: sectionProgress(checklist),
    warnings: fieldWarnings(checklist),
    region: mpan?.ok ? mpan.region : null,
    editable: editableStages.includes(row.stage),
    address: { addressLine1: row.addressLine1, addressLine2: row.addressLine2, town: row.town, postcode: row.postcode },
    siteMeasures: readSiteMeasures(row.siteMeasures),
    readiness: { light: row.readinessLight, gapCount: row.readinessGaps, checks: row.readinessChecks as CheckResult[], at: row.readinessAt?.toISOString() ?? null },
    surveyDate: row.surveyDate,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
  };
}
