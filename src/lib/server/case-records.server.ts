// Server-only: a case's notes, audit trail and e-mail history, for the case page.
import { asc, desc, eq } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { auditLog, caseNotes, emailLog, users } from '../../db/schema';
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
  await audit({ caseId, actorId: user.id, action: 'note.added', entity: 'note', entityId: note!.id, after: { body } });
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

/**
 * A case's e-mail history, newest first. The stored text has its sign-in links removed already;
 * the office sees it, a surveyor only what was sent when (kind and subject), not its words.
 */
export async function listEmails(caseId: string, { withText }: { withText: boolean }) {
  const rows = await db()
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
  return withText ? rows : rows.map(({ id, kind, subject, createdAt }) => ({ id, kind, subject, createdAt }));
}
