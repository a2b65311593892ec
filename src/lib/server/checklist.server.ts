// Server-only: saving the customer's checklist and sending it for review.
import { and, eq, sql } from 'drizzle-orm';
import { cases, type CaseRow } from '@/db/schema';
import { checklistConflicts, mergeChecklist, sectionProgress, type Checklist, type ChecklistPatch } from '@/lib/schemas/checklist';
import { audit } from './audit.server';
import { editableStages, toCaseView } from './case-view.server';
import { transaction } from './db.server';
import { computeReadiness, readinessColumns } from './readiness.server';
import { refreshSearchTextSql } from '@/db/search-text';
import { readinessSettings } from './settings.server';
import { HttpError } from './http';
import { noteChangeSinceReady, tellOfficeOfChange } from './changes-since-ready.server';
import { firm } from './office.server';
import { staffLabel } from '@/lib/vocabulary/fields';
import type { SessionUser } from './users.server';

/** Only the fields that really change, as { path: [before, after] }, for the audit trail. */
function diff(before: Checklist, after: Checklist): Record<string, [unknown, unknown]> {
  const out: Record<string, [unknown, unknown]> = {};
  const flat = (o: unknown, prefix = ''): Record<string, unknown> =>
    o && typeof o === 'object' && !Array.isArray(o) && !(prefix.endsWith('.plan'))
      ? Object.assign({}, ...Object.entries(o).map(([k, v]) => flat(v, prefix ? `${prefix}.${k}` : k)))
      : { [prefix]: o };
  const a = flat(before);
  const b = flat(after);
  for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) {
    if (JSON.stringify(a[key]) !== JSON.stringify(b[key])) out[key] = [a[key] ?? null, b[key] ?? null];
  }
  return out;
}

/**
 * Merges a validated patch into the case's checklist, if the caller's version is current.
 * @throws HttpError 409 `conflict` (with the current case) when another save came first.
 */
export async function saveChecklist(user: SessionUser, row: CaseRow, patch: ChecklistPatch, ifVersion: number | null) {
  if (!editableStages.includes(row.stage)) {
    throw new HttpError(409, 'conflict', 'This case can no longer be changed. Please contact your installer.', undefined, { reason: 'locked' });
  }
  // Read before the transaction opens: inside it, every query must go through tx.
  const settings = await readinessSettings();
  let changedAfterReady: string | null = null;
  const view = await transaction(async (tx) => {
    const [current] = await tx.select().from(cases).where(eq(cases.id, row.id)).for('update');
    if (!current) throw new HttpError(404, 'not_found', 'That case was not found.');
    if (ifVersion !== null && current.version !== ifVersion) {
      throw new HttpError(409, 'conflict', 'These answers were changed on another device or tab. The newer answers are loaded.', undefined, {
        current: toCaseView(current, user.role),
      });
    }
    const before = current.checklist as Checklist;
    const after = mergeChecklist(before, patch);
    // Checked on the merged answers, since the two fields sit in different sections.
    const conflicts = checklistConflicts(after);
    if (Object.keys(conflicts).length > 0) {
      throw new HttpError(422, 'invalid', 'Some answers do not fit together. Nothing was saved.', conflicts);
    }
    const changes = diff(before, after);
    // A detail from the invitation that the customer answers themselves is theirs from now on.
    const prefilled = remainingPrefilled(current.prefilled, patch);
    if (Object.keys(changes).length === 0 && prefilled.length === current.prefilled.length) return toCaseView(current, user.role);
    const about = after.about ?? {};
    const isCustomer = user.role === 'customer';
    // Readiness of the new answers, stored by the same UPDATE: fewer round trips while the row is locked.
    const readiness = await computeReadiness(tx, { id: row.id, checklist: after, siteMeasures: current.siteMeasures }, settings);
    const [saved] = await tx
      .update(cases)
      .set({
        checklist: after,
        prefilled,
        version: sql`${cases.version} + 1`,
        updatedAt: new Date(),
        ...readinessColumns(readiness),
        // The office's queue reads the address from the case's own columns: copy the address
        // fields this save sends (a value, or null to clear), and keep the others as they are.
        ...addressColumns(patch, about),
        ...(isCustomer ? { lastCustomerActivityAt: new Date() } : {}),
        ...(current.stage === 'invited' && isCustomer ? { stage: 'filling_in' as const } : {}),
      })
      .where(and(eq(cases.id, row.id)))
      .returning();
    await audit(tx, {
      caseId: row.id,
      actorId: user.id,
      action: 'checklist.updated',
      entity: 'case',
      entityId: row.id,
      before: Object.fromEntries(Object.entries(changes).map(([k, [b]]) => [k, b])),
      after: Object.fromEntries(Object.entries(changes).map(([k, [, a]]) => [k, a])),
    });
    // The office's search reads the postcode (about) and the MPAN (supply); nothing else here feeds it.
    if ('about' in patch || 'supply' in patch) await tx.execute(refreshSearchTextSql(row.id));
    const detail = changedFieldWords(Object.keys(changes));
    const flagged = await noteChangeSinceReady(tx, user, row.id, { what: 'answers', detail });
    if (flagged) changedAfterReady = detail;
    if (current.stage !== saved!.stage) {
      await audit(tx, { caseId: row.id, actorId: user.id, action: 'stage.changed', entity: 'case', entityId: row.id, before: { stage: current.stage }, after: { stage: saved!.stage } });
    }
    if (saved!.stage !== 'ready_for_survey') return toCaseView(saved!, user.role);
    // A change after sign-off is noted on the case row: read it back so the answer shows it.
    const [fresh] = await tx.select().from(cases).where(eq(cases.id, row.id));
    return toCaseView(fresh!, user.role);
  });
  if (changedAfterReady !== null) await tellOfficeOfChange(row, user, { what: 'answers', detail: changedAfterReady }, (await firm()).email);
  return view;
}

const ADDRESS_FIELDS = ['addressLine1', 'addressLine2', 'town', 'postcode'] as const;

function addressColumns(patch: ChecklistPatch, about: NonNullable<Checklist['about']>) {
  const sent = patch.about ?? {};
  return Object.fromEntries(ADDRESS_FIELDS.filter((f) => f in sent && sent[f] !== undefined).map((f) => [f, about[f] ?? null]));
}

/** The invitation's details still unconfirmed once this patch's own answers are taken out. */
function remainingPrefilled(prefilled: string[], patch: ChecklistPatch): string[] {
  const sent = patch.about ?? {};
  return prefilled.filter((path) => {
    const [section, field] = path.split('.');
    return !(section === 'about' && field! in sent && (sent as Record<string, unknown>)[field!] !== undefined);
  });
}

/**
 * The customer confirms details the installer filled in from the invitation (one step's): they
 * count as answered from now on. Nothing else changes; confirming again changes nothing.
 * @example await confirmDetails(user, row, ['about.fullName']) // the case view without about.fullName in prefilled
 */
export async function confirmDetails(user: SessionUser, row: CaseRow, paths: readonly string[]) {
  if (!editableStages.includes(row.stage)) {
    throw new HttpError(409, 'conflict', 'This case can no longer be changed. Please contact your installer.', undefined, { reason: 'locked' });
  }
  return transaction(async (tx) => {
    const [current] = await tx.select().from(cases).where(eq(cases.id, row.id)).for('update');
    if (!current) throw new HttpError(404, 'not_found', 'That case was not found.');
    const remaining = current.prefilled.filter((path) => !paths.includes(path));
    if (remaining.length === current.prefilled.length) return toCaseView(current, user.role);
    const [saved] = await tx
      .update(cases)
      .set({
        prefilled: remaining,
        detailsConfirmedAt: new Date(),
        version: sql`${cases.version} + 1`,
        updatedAt: new Date(),
        lastCustomerActivityAt: new Date(),
        ...(current.stage === 'invited' ? { stage: 'filling_in' as const } : {}),
      })
      .where(eq(cases.id, row.id))
      .returning();
    await audit(tx, { caseId: row.id, actorId: user.id, action: 'checklist.confirmed', entity: 'case', entityId: row.id, before: { prefilled: current.prefilled }, after: { prefilled: remaining } });
    if (current.stage !== saved!.stage) {
      await audit(tx, { caseId: row.id, actorId: user.id, action: 'stage.changed', entity: 'case', entityId: row.id, before: { stage: current.stage }, after: { stage: saved!.stage } });
    }
    return toCaseView(saved!, user.role);
  });
}

/** "Main fuse (cut-out), as read, Electric shower" — the office's labels for changed paths. */
function changedFieldWords(paths: string[]): string {
  return [...new Set(paths.map(staffLabel))].join(', ');
}

export type Gap = { section: string; title: string; missing: string[] };

export function gapsOf(checklist: Checklist): Gap[] {
  return sectionProgress(checklist)
    .filter((s) => !s.complete)
    .map((s) => ({ section: s.id, title: s.title, missing: s.missing }));
}

/** Moves the case to "Sent for review"; with gaps only once the customer has seen them. */
export async function submitCase(user: SessionUser, row: CaseRow, acknowledgeGaps: boolean) {
  if (row.stage !== 'invited' && row.stage !== 'filling_in') {
    throw new HttpError(409, 'conflict', 'This case has already been sent to your installer.', undefined, { reason: 'already-sent' });
  }
  const gaps = gapsOf(row.checklist as Checklist);
  if (gaps.length > 0 && !acknowledgeGaps) {
    throw new HttpError(409, 'conflict', 'Some answers are still missing. Send anyway?', undefined, { gaps });
  }
  const [saved] = await transaction(async (tx) => {
    const result = await tx
      .update(cases)
      .set({ stage: 'sent_for_review', submittedAt: new Date(), updatedAt: new Date(), lastCustomerActivityAt: new Date(), version: sql`${cases.version} + 1` })
      .where(eq(cases.id, row.id))
      .returning();
    await audit(tx, { caseId: row.id, actorId: user.id, action: 'stage.changed', entity: 'case', entityId: row.id, before: { stage: row.stage }, after: { stage: 'sent_for_review', gaps: gaps.length } });
    return result;
  });
  return { view: toCaseView(saved!, user.role), gaps };
}
