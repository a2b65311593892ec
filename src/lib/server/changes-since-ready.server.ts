// Server-only: once the office has marked a case Ready for survey (with or without overriding red
// checks), what the customer changes afterwards must not slip past unseen. Each change is kept on
// the case (changed_since_ready_at, changes_since_ready), shown in the queue and on the case page,
// and the first one after sign-off is e-mailed to the office. Booking (or any other stage move)
// means the office has looked again and clears it.
import { and, eq, isNull, sql } from 'drizzle-orm';
import { cases, type CaseRow } from '@/db/schema';
import { audit } from './audit.server';
import { sendCaseMail } from './case-mail.server';
import { config } from './config.server';
import { db, type Tx } from './db.server';
import { changedSinceReadyEmail } from './email-templates.server';
import type { SessionUser } from './users.server';

export type ChangeSinceReady = { at: string; what: 'answers' | 'upload_added' | 'upload_removed'; detail: string };

/**
 * Records a customer's change to a case that is Ready for survey, inside the caller's transaction.
 * @returns true when this is the first change since sign-off (the office should be told), else false.
 * @example const first = await noteChangeSinceReady(tx, user, row.id, { what: 'answers', detail: 'supply.mainFuseAmps' });
 */
export async function noteChangeSinceReady(tx: Tx, actor: SessionUser, caseId: string, change: Omit<ChangeSinceReady, 'at'>): Promise<boolean> {
  if (actor.role !== 'customer') return false;
  const entry: ChangeSinceReady = { at: new Date().toISOString(), ...change };
  const [first] = await tx
    .update(cases)
    .set({ changedSinceReadyAt: sql`now()` })
    .where(and(eq(cases.id, caseId), eq(cases.stage, 'ready_for_survey'), isNull(cases.changedSinceReadyAt)))
    .returning({ id: cases.id });
  const [noted] = await tx
    .update(cases)
    .set({ changesSinceReady: sql`${cases.changesSinceReady} || ${JSON.stringify([entry])}::jsonb` })
    .where(and(eq(cases.id, caseId), eq(cases.stage, 'ready_for_survey')))
    .returning({ id: cases.id });
  if (!noted) return false;
  await audit(tx, { caseId, actorId: actor.id, action: 'case.changed_since_ready', entity: 'case', entityId: caseId, after: change });
  return !!first;
}

/** Clears the flag when the office moves the case on (inside the stage move's transaction). */
export async function clearChangesSinceReady(tx: Tx, caseId: string): Promise<void> {
  await tx.update(cases).set({ changedSinceReadyAt: null, changesSinceReady: [] }).where(eq(cases.id, caseId));
}

const whatWords: Record<ChangeSinceReady['what'], string> = {
  answers: 'changed answers',
  upload_added: 'sent a file',
  upload_removed: 'removed a file',
};

/** Words for one change, for the queue, the case page and the e-mail. */
export function describeChange(c: Pick<ChangeSinceReady, 'what' | 'detail'>): string {
  return `${whatWords[c.what]}: ${c.detail}`;
}

/**
 * E-mails the office that a case marked ready has changed. Never fails the customer's save:
 * the flag in the queue is the record, the e-mail only the nudge.
 */
export async function tellOfficeOfChange(row: Pick<CaseRow, 'id' | 'reference'>, actor: SessionUser, change: Omit<ChangeSinceReady, 'at'>, officeEmail: string): Promise<void> {
  try {
    await sendCaseMail({
      caseId: row.id,
      kind: 'changed_since_ready',
      sentById: actor.id,
      mail: {
        to: officeEmail,
        ...changedSinceReadyEmail({ actorName: actor.name ?? actor.email, reference: row.reference, change: describeChange(change), url: `${config.appUrl}/office/cases/${row.id}` }),
      },
    });
  } catch (err) {
    console.error('[changes-since-ready] could not e-mail the office', err);
  }
}
