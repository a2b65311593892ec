// Server-only: writes the audit trail — who changed what, when, with before and after.
import { auditLog } from '../../db/schema';
import { db } from './db.server';

type Tx = Parameters<Parameters<ReturnType<typeof db>['transaction']>[0]>[0];

export type AuditEntry = {
  caseId?: string | null;
  actorId?: string | null;
  action: string;
  entity: string;
  entityId?: string | null;
  before?: unknown;
  after?: unknown;
};

/** Records one change; pass the transaction so the entry commits (or not) with the change. */
export async function audit(entry: AuditEntry, tx: Tx | ReturnType<typeof db> = db()) {
  await tx.insert(auditLog).values({
    caseId: entry.caseId ?? null,
    actorId: entry.actorId ?? null,
    action: entry.action,
    entity: entry.entity,
    entityId: entry.entityId ?? null,
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
