// Server-only: every e-mail about a case goes through here, so it is logged for the case page.
import { eq } from 'drizzle-orm';
import { emailLog } from '../../db/schema';
import { db } from './db.server';
import { sendMail, type OutgoingMail } from './mail.server';

export type CaseMailKind = 'invitation' | 'chase' | 'reminder' | 'rejection' | 'survey_booked' | 'submitted' | 'outcome';

/**
 * Sends and logs one e-mail. With a dedupeKey, the log row is written first under a unique key,
 * so a retried job can never send the same reminder twice (at most once, by design).
 * @returns false when the dedupeKey was already used and nothing was sent.
 */
export async function sendCaseMail(input: { caseId: string | null; kind: CaseMailKind; mail: OutgoingMail; sentById?: string | null; dedupeKey?: string }): Promise<boolean> {
  const [row] = await db()
    .insert(emailLog)
    .values({
      caseId: input.caseId,
      kind: input.kind,
      toEmail: input.mail.to,
      subject: input.mail.subject,
      text: input.mail.text,
      sentById: input.sentById ?? null,
      dedupeKey: input.dedupeKey ?? null,
    })
    .onConflictDoNothing({ target: emailLog.dedupeKey })
    .returning({ id: emailLog.id });
  if (!row) return false;
  try {
    await sendMail(input.mail);
  } catch (err) {
    // Not sent, so not history: remove the row (a scheduled reminder may then try again).
    await db().delete(emailLog).where(eq(emailLog.id, row.id));
    throw err;
  }
  return true;
}
