// Server-only: the JSON shape of one case as the API and pages hand it out.
import type { CaseRow, Role } from '../../db/schema';
import { fieldWarnings, sectionProgress, type Checklist } from '../schemas/checklist';
import { checkMpanCore } from '../validation/mpan';
import type { CheckResult } from '../readiness';
import { readSiteMeasures } from '../schemas/outcome';

/** Stages in which the customer may still change their answers. */
export const editableStages: CaseRow['stage'][] = ['invited', 'filling_in', 'sent_for_review', 'in_review', 'ready_for_survey'];

export type CaseView = ReturnType<typeof toCaseView>;

// Actions written for the firm, not the customer ("The office to apply…", "The installer to plan…").
const STAFF_ACTION = /^(the|our) (office|installer|surveyor|electrician)\b/i;
// The firm's half of a shared action ("Answer the load questions, or the office to record…").
const STAFF_CLAUSE = /,? or (the|our) (office|installer|surveyor|electrician) to\b.*$/i;

/** The customer's part of an action, or null when it is the firm's alone. @example customerAction('Answer X, or the office to record Y.') // 'Answer X.' */
export function customerAction(action: string): string | null {
  if (STAFF_ACTION.test(action)) return null;
  return STAFF_CLAUSE.test(action) ? `${action.replace(STAFF_CLAUSE, '').replace(/[.,;:\s]+$/, '')}.` : action;
}

/**
 * The checks as a viewer may see them: staff get everything; a customer gets their own words
 * only — no staffText, no figures, no actions meant for the firm.
 * @example checksFor(checks, 'customer')[0] // { id, light, title, customerText, actions, source }
 */
export function checksFor(checks: CheckResult[], role: Role) {
  if (role !== 'customer') return checks;
  return checks.map((c) => ({
    id: c.id,
    light: c.light,
    title: c.title,
    customerText: c.customerText,
    source: c.source,
    actions: c.actions.map(customerAction).filter((a): a is string => a !== null),
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
