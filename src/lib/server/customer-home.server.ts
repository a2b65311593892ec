// Server-only: what the customer's home page shows for each of their cases — readiness in their
// own words, what is done and still needed, the survey once booked — and how to reach the installer.
import { desc, eq, inArray } from 'drizzle-orm';
import { cases, users } from '@/db/schema';
import type { Checklist } from '@/lib/schemas/checklist';
import type { CheckResult } from '@/lib/readiness';
import { customerNext } from '@/lib/customer-next';
import { checksFor } from './case-view.server';
import { db } from './db.server';
import { firm } from './office.server';
import { uploadSummaries } from './readiness.server';
import type { SessionUser } from './users.server';

/**
 * The customer's cases, newest first, each with what the home page says about it.
 * @example (await customerHome(user)).cases[0].next.needed[0] // { step: 'supply', stepTitle: 'Your meter and fuse', text: 'Add …' }
 */
export async function customerHome(user: SessionUser) {
  const rows = await db().select().from(cases).where(eq(cases.customerId, user.id)).orderBy(desc(cases.invitedAt));
  const surveyorIds = [...new Set(rows.map((r) => r.surveyorId).filter((id): id is string => id !== null))];
  const surveyors = surveyorIds.length ? await db().select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, surveyorIds)) : [];
  const installer = await firm();
  const list = await Promise.all(
    rows.map(async (row) => {
      const checklist = (row.checklist ?? {}) as Checklist;
      const uploads = await uploadSummaries(db(), row.id);
      const surveyor = surveyors.find((s) => s.id === row.surveyorId);
      return {
        id: row.id,
        reference: row.reference,
        stage: row.stage,
        address: [row.addressLine1, row.town, row.postcode].filter(Boolean).join(', '),
        light: row.readinessLight,
        // The customer's words only: never the staff text, the figures or the firm's own actions.
        checks: checksFor(row.readinessChecks as CheckResult[], 'customer'),
        next: customerNext(checklist, row.prefilled ?? [], uploads),
        surveyDate: row.surveyDate,
        // First name only: enough to know who is coming.
        surveyorFirstName: surveyor?.name?.trim().split(/\s+/)[0] ?? null,
      };
    }),
  );
  return { cases: list, installer };
}
