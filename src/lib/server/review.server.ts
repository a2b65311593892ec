// Server-only: the office accepts or rejects an upload; a rejection tells the customer why.
import { eq } from 'drizzle-orm';
import { uploads, users, type CaseRow } from '@/db/schema';
import { uploadKindInfo } from '@/lib/schemas/uploads';
import { uploadKindLabels } from '@/lib/readiness/upload-status';
import { audit } from './audit.server';
import { sendCaseMail } from './case-mail.server';
import { db, transaction } from './db.server';
import { rejectionEmail } from './email-templates.server';
import { refreshReadiness } from './readiness.server';
import { readinessSettings } from './settings.server';
import { signInLink } from './sign-in-links.server';
import { toUploadItem } from './uploads.server';
import type { SessionUser } from './users.server';

type UploadRow = typeof uploads.$inferSelect;

export async function reviewUpload(admin: SessionUser, row: UploadRow, caseRow: CaseRow, decision: 'accepted' | 'rejected', reason?: string) {
  // Read before the transaction opens: inside it, every query must go through tx.
  const settings = await readinessSettings();
  const saved = await transaction(async (tx) => {
    const [updated] = await tx
      .update(uploads)
      .set({ status: decision, reason: decision === 'rejected' ? reason! : null, reviewedBy: admin.id, reviewedAt: new Date() })
      .where(eq(uploads.id, row.id))
      .returning();
    await audit(tx, { caseId: row.caseId, actorId: admin.id, action: `upload.${decision}`, entity: 'upload', entityId: row.id, before: { status: row.status, reason: row.reason }, after: { status: decision, reason: reason ?? null } });
    await refreshReadiness(tx, row.caseId, settings);
    return updated!;
  });
  if (decision === 'rejected') {
    const [customer] = await db().select().from(users).where(eq(users.id, caseRow.customerId));
    if (customer) {
      const url = await signInLink(customer.email, { days: 7, next: `/my/cases/${caseRow.id}` });
      await sendCaseMail({
        caseId: caseRow.id,
        kind: 'rejection',
        sentById: admin.id,
        mail: {
          to: customer.email,
          ...rejectionEmail({ customerName: customer.name ?? '', what: uploadKindLabels[row.kind], reason: reason!, goodLooksLike: uploadKindInfo[row.kind].hint, url }),
        },
      });
    }
  }
  return toUploadItem(saved);
}
