// Server-only: writes the audit trail — who changed what, when, with before and after.
import { auditLog } from '@/db/schema';
import type { Conn } from './db.server';

export type AuditEntry = {
  caseId?: string | null;
  actorId?: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  before?: unknown;
  after?: unknown;
};

/**
 * Records one change; inside a transaction pass it, so the entry commits (or not) with the change.
 * @example await audit(tx, { caseId, actorId, action: 'note.added', entity: 'note', entityId });
 */
export async function audit(conn: Conn, entry: AuditEntry) {
  await conn.insert(auditLog).values({
    caseId: entry.caseId ?? null,
    actorId: entry.actorId ?? null,
    action: entry.action,
    entity: entry.entity,
    entityId: entry.entityId ?? null,
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
