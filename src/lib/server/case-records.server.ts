// Server-only: a case's notes, audit trail and e-mail history, for the case page.
import { asc, desc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { auditLog, caseNotes, emailLog, textLog, users } from '@/db/schema';
import { audit } from './audit.server';
import { db } from './db.server';
import type { SessionUser } from './users.server';

const author = alias(users, 'author');

export async function listNotes(caseId: string) {
  return db()
    .select({ id: caseNotes.id, body: caseNotes.body, createdAt: caseNotes.createdAt, authorName: author.name, authorId: caseNotes.authorId })
    .from(caseNotes)
    .leftJoin(author, eq(author.id, caseNotes.authorId))
    .where(eq(caseNotes.caseId, caseId))
    .orderBy(asc(caseNotes.createdAt));
}

export async function addNote(user: SessionUser, caseId: string, body: string) {
  const [note] = await db().insert(caseNotes).values({ caseId, authorId: user.id, body }).returning();
  await audit(db(), { caseId, actorId: user.id, action: 'note.added', entity: 'note', entityId: note!.id, after: { body } });
  return { ...note!, authorName: user.name };
}

export async function listAudit(caseId: string) {
  return db()
    .select({
      id: auditLog.id,
      action: auditLog.action,
      entity: auditLog.entity,
      entityId: auditLog.entityId,
      before: auditLog.before,
      after: auditLog.after,
      at: auditLog.at,
      actorId: auditLog.actorId,
      actorName: author.name,
      actorRole: author.role,
    })
    .from(auditLog)
    .leftJoin(author, eq(author.id, auditLog.actorId))
    .where(eq(auditLog.caseId, caseId))
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(500);
}

/** A case's stored e-mails, newest first; their text already has its sign-in links removed. */
async function emailRows(caseId: string) {
  return db()
    .select({
      id: emailLog.id,
      kind: emailLog.kind,
      toEmail: emailLog.toEmail,
      subject: emailLog.subject,
      text: emailLog.text,
      createdAt: emailLog.createdAt,
      sentByName: author.name,
    })
    .from(emailLog)
    .leftJoin(author, eq(author.id, emailLog.sentById))
    .where(eq(emailLog.caseId, caseId))
    .orderBy(desc(emailLog.createdAt));
}

/**
 * A case's e-mail history, newest first. The office sees each message's text; a surveyor only
 * what was sent when (kind and subject), not its words or its recipient.
 */
export async function listEmails(caseId: string, { withText }: { withText: boolean }) {
  const rows = await emailRows(caseId);
  return withText ? rows : rows.map(({ id, kind, subject, createdAt }) => ({ id, kind, subject, createdAt }));
}

/** One message in the case's history, e-mail or text, as the office reads it. */
export type MessageItem = {
  id: string;
  channel: 'email' | 'text';
  direction: 'outbound' | 'inbound';
  kind: string;
  to: string;
  subject: string | null;
  text: string;
  status: string;
  statusDetail: string | null;
  statusAt: string | null;
  createdAt: string;
  sentByName: string | null;
};

/** What a surveyor sees of one message. */
export type MessageSummary = Pick<MessageItem, 'id' | 'channel' | 'direction' | 'kind' | 'subject' | 'status' | 'createdAt'>;

/** E-mails and texts together, newest first. An e-mail is logged once sent, so its status is "sent". */
export async function listMessages(caseId: string, { withText }: { withText: boolean }): Promise<MessageItem[] | MessageSummary[]> {
  const emails = await emailRows(caseId);
  const texts = await db()
    .select({
      id: textLog.id,
      direction: textLog.direction,
      kind: textLog.kind,
      mobile: textLog.mobile,
      text: textLog.text,
      status: textLog.status,
      statusDetail: textLog.statusDetail,
      statusAt: textLog.statusAt,
      createdAt: textLog.createdAt,
      sentByName: author.name,
    })
    .from(textLog)
    .leftJoin(author, eq(author.id, textLog.sentById))
    .where(eq(textLog.caseId, caseId))
    .orderBy(desc(textLog.createdAt));
  const items: MessageItem[] = [
    ...emails.map((m) => ({
      id: m.id, channel: 'email' as const, direction: 'outbound' as const, kind: m.kind, to: m.toEmail, subject: m.subject, text: m.text,
      status: 'sent', statusDetail: null, statusAt: null, createdAt: m.createdAt.toISOString(), sentByName: m.sentByName,
    })),
    ...texts.map((t) => ({
      id: t.id, channel: 'text' as const, direction: t.direction === 'inbound' ? ('inbound' as const) : ('outbound' as const), kind: t.kind, to: t.mobile,
      subject: null, text: t.text, status: t.status, statusDetail: t.statusDetail, statusAt: t.statusAt?.toISOString() ?? null,
      createdAt: t.createdAt.toISOString(), sentByName: t.sentByName,
    })),
  ];
  items.sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  // A surveyor sees that a message went and how it fared, not its words or where it went.
  return withText ? items : items.map(({ id, channel, direction, kind, subject, status, createdAt }) => ({ id, channel, direction, kind, subject, status, createdAt }));
}
