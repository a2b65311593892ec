// Server-only: every e-mail about a case goes through here, so it is logged for the case page.
import { eq } from 'drizzle-orm';
import { emailLog } from '@/db/schema';
import { db } from './db.server';
import { sendMail, type OutgoingMail } from './mail.server';

/** What the stored copy shows where the message carried a link that signs someone in. */
export const REDACTED_LINK = '[sign-in link — sent to the customer, not kept]';

/**
 * The message text as it may be kept: every link that carries a token (a sign-in link, a
 * password link) is replaced, so nobody who reads the case's e-mails can use it.
 * @example redactLinks('Sign in: https://a.example/api/auth/callback/nodemailer?token=abc') // 'Sign in: [sign-in link — …]'
 */
export function redactLinks(text: string): string {
  return text.replace(/\bhttps?:\/\/[^\s<>"']+/gi, (url) => (/[?&](token|code|key|signature)=|\/api\/auth\/callback\//i.test(url) ? REDACTED_LINK : url));
}

export type CaseMailKind = 'invitation' | 'chase' | 'reminder' | 'rejection' | 'survey_booked' | 'submitted' | 'outcome' | 'changed_since_ready';

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
      // Never the live link: the stored copy is for reading, not for signing in.
      text: redactLinks(input.mail.text),
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
