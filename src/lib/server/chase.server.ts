// Server-only: chasing a customer for what is missing — by hand from the office, or on a schedule.
import { eq, sql } from 'drizzle-orm';
import { cases, users, type CaseRow, type User } from '@/db/schema';
import { customerGaps } from '@/lib/gaps';
import type { Checklist } from '@/lib/schemas/checklist';
import { audit } from './audit.server';
import { sendCaseMail } from './case-mail.server';
import { db } from './db.server';
import { chaseEmail } from './email-templates.server';
import { HttpError } from './http';
import { firm } from './office.server';
import { uploadSummaries } from './readiness.server';
import { signInLink } from './sign-in-links.server';
import { reminderText } from '@/lib/text-rules';
import { sendCaseText, textDecisionFor } from './text-messages.server';

export type ChaseResult = { caseId: string; sent: boolean; items: string[]; reason?: string; text?: { sent: boolean; reason?: string } };

/**
 * E-mails the customer exactly what is missing or rejected, with a sign-in link, and records it.
 * A reminder passes its slot as dedupeKey so it cannot go twice.
 */
export async function chaseCase(row: CaseRow, opts: { actorId: string | null; reminder?: boolean; dedupeKey?: string; now?: Date }): Promise<ChaseResult> {
  const items = customerGaps(row.checklist as Checklist, await uploadSummaries(db(), row.id)).map((g) => g.text);
  if (items.length === 0) return { caseId: row.id, sent: false, items, reason: 'Nothing is missing.' };
  if (row.stage === 'surveyed' || row.stage === 'withdrawn') return { caseId: row.id, sent: false, items, reason: 'The case is closed.' };
  const [customer] = await db().select().from(users).where(eq(users.id, row.customerId));
  if (!customer?.active) return { caseId: row.id, sent: false, items, reason: 'The customer’s account is not active.' };
  const office = await firm();
  const url = await signInLink(customer.email, { days: 7, next: `/my/cases/${row.id}` });
  const sent = await sendCaseMail({
    caseId: row.id,
    kind: opts.reminder ? 'reminder' : 'chase',
    sentById: opts.actorId,
    dedupeKey: opts.dedupeKey,
    mail: { to: customer.email, ...chaseEmail({ customerName: customer.name ?? '', firmName: office.name, items, url, reminder: opts.reminder }) },
  });
  if (!sent) return { caseId: row.id, sent: false, items, reason: 'Already sent.' };
  await db()
    .update(cases)
    .set({ lastChasedAt: new Date(), ...(opts.reminder ? { remindersSent: sql`${cases.remindersSent} + 1` } : {}) })
    .where(eq(cases.id, row.id));
  await audit(db(), { caseId: row.id, actorId: opts.actorId, action: opts.reminder ? 'case.reminded' : 'case.chased', entity: 'case', entityId: row.id, after: { items } });
  const text = await chaseByText(row, customer, items.length, office.name, opts);
  return { caseId: row.id, sent: true, items, text };
}

/**
 * The short text beside a chase e-mail, where the customer agreed to texts and it is not quiet
 * hours. A reminder's text takes the reminder's slot key, so one reminder never texts twice.
 */
async function chaseByText(row: CaseRow, customer: User, count: number, firmName: string, opts: { actorId: string | null; reminder?: boolean; dedupeKey?: string; now?: Date }) {
  const decision = await textDecisionFor(customer.id, opts.now);
  if (!decision.send) return { sent: false, reason: decision.reason };
  // A link of its own: the e-mail's link works once, and either may be the one they open.
  const url = await signInLink(customer.email, { days: 7, next: `/my/cases/${row.id}` });
  const sent = await sendCaseText({
    caseId: row.id,
    userId: customer.id,
    kind: opts.reminder ? 'reminder' : 'chase',
    mobile: decision.mobile,
    text: reminderText({ firstName: (customer.name ?? '').split(' ')[0] || 'there', firmName, count, url }),
    sentById: opts.actorId,
    dedupeKey: opts.dedupeKey ? `${opts.dedupeKey}:text` : undefined,
  });
  return sent ? { sent: true } : { sent: false, reason: 'The text was not accepted; see the message history.' };
}

/** The office's chase button: 409 when there is nothing to chase. */
export async function chaseFromOffice(row: CaseRow, actorId: string): Promise<ChaseResult> {
  const result = await chaseCase(row, { actorId });
  if (!result.sent) throw new HttpError(409, 'conflict', result.reason ?? 'Nothing to chase.');
  return result;
}
