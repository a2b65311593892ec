// Server-only: the JSON shape of one case as the API and pages hand it out.
import type { CaseRow, Role } from '@/db/schema';
import { fieldWarnings, sectionProgress, type Checklist } from '@/lib/schemas/checklist';
import { checkMpanCore } from '@/lib/validation/mpan';
import type { CheckResult } from '@/lib/readiness';
import { readSiteMeasures } from '@/lib/schemas/outcome';
import { customerActionsFor } from '@/lib/vocabulary/readiness';

/** Stages in which the customer may still change their answers. */
export const editableStages: CaseRow['stage'][] = ['invited', 'filling_in', 'sent_for_review', 'in_review', 'ready_for_survey'];

export type CaseView = ReturnType<typeof toCaseView>;

/**
 * The checks as a viewer may see them: staff get everything; a customer gets their own words
 * only — no staffText, no figures, no source, and none of the checks' actions (those are written
 * for the firm): in their place, where in the checklist the customer can act.
 * @example checksFor(checks, 'customer')[0] // { id, light, title, customerText, customerActions }
 */
export function checksFor(checks: CheckResult[], role: Role) {
  if (role !== 'customer') return checks;
  return checks.map((c) => ({
    id: c.id,
    light: c.light,
    title: c.title,
    customerText: c.customerText,
    customerActions: customerActionsFor(c),
  }));
}

/** The case as its customer (customer words only) or staff see it through the API. */
export function toCaseView(row: CaseRow, role: Role) {
  const checklist = (row.checklist ?? {}) as Checklist;
  const mpan = checklist.supply?.mpanCore ? checkMpanCore(checklist.supply.mpanCore) : null;
  return {
    id: row.id,
    reference: row.reference,
    stage: row.stage,
    version: row.version,
    checklist,
    progress: sectionProgress(checklist),
    // Answers from the invitation the customer has not confirmed yet (dotted paths).
    prefilled: (row.prefilled ?? []) as string[],
    warnings: fieldWarnings(checklist),
    region: mpan?.ok ? mpan.region : null,
    editable: editableStages.includes(row.stage),
    address: { addressLine1: row.addressLine1, addressLine2: row.addressLine2, town: row.town, postcode: row.postcode },
    siteMeasures: readSiteMeasures(row.siteMeasures),
    readiness: { light: row.readinessLight, gapCount: row.readinessGaps, checks: checksFor(row.readinessChecks as CheckResult[], role), at: row.readinessAt?.toISOString() ?? null },
    surveyDate: row.surveyDate,
    // For the office: what the customer changed after the case was marked ready.
    changedSinceReady:
      role !== 'customer' && row.changedSinceReadyAt
        ? { at: row.changedSinceReadyAt.toISOString(), changes: row.changesSinceReady as { at: string; what: string; detail: string }[] }
        : null,
    submittedAt: row.submittedAt?.toISOString() ?? null,
    updatedAt: row.updatedAt.toISOString(),
  };
}
