// Server-only: inviting a customer — account if new, a case, an e-mailed sign-in link.
import { and, eq, notInArray } from 'drizzle-orm';
import { cases, users } from '@/db/schema';
import { newCaseReference } from '@/lib/case-reference';
import type { Invite } from '@/lib/schemas/invite';
import { audit } from './audit.server';
import { sendCaseMail } from './case-mail.server';
import { transaction } from './db.server';
import { invitationEmail } from './email-templates.server';
import { HttpError } from './http';
import { firm } from './office.server';
import { refreshReadiness } from './readiness.server';
import { readinessSettings } from './settings.server';
import { signInLink } from './sign-in-links.server';
import type { SessionUser } from './users.server';

/**
 * Creates the customer (if new) and an open case, then e-mails the invitation.
 * @throws HttpError 409 when the e-mail already has an open case, or belongs to staff.
 */
export async function inviteCustomer(admin: SessionUser, input: Invite) {
  const email = input.customer.email;
  // Read before the transaction opens: inside it, every query must go through tx.
  const settings = await readinessSettings();
  const created = await transaction(async (tx) => {
    let [customer] = await tx.select().from(users).where(eq(users.email, email)).for('update');
    if (customer && customer.role !== 'customer') {
      throw new HttpError(422, 'invalid', 'That e-mail belongs to a staff account.', { 'customer.email': 'This address belongs to a member of staff.' });
    }
    if (customer) {
      const [open] = await tx
        .select({ id: cases.id, reference: cases.reference })
        .from(cases)
        .where(and(eq(cases.customerId, customer.id), notInArray(cases.stage, ['surveyed', 'withdrawn'])))
        .limit(1);
      if (open) {
        throw new HttpError(409, 'conflict', `${email} already has an open case (${open.reference}).`, undefined, {
          caseId: open.id,
          url: `/office/cases/${open.id}`,
        });
      }
    } else {
      [customer] = await tx.insert(users).values({ email, name: input.customer.name, role: 'customer', phone: input.customer.phone }).returning();
      await audit(tx, { actorId: admin.id, action: 'user.created', entity: 'user', entityId: customer!.id, after: { email, role: 'customer' } });
    }
    const a = input.address ?? {};
    const checklist = {
      about: Object.fromEntries(
        Object.entries({ fullName: input.customer.name, email, phone: input.customer.phone, ...a }).filter(([, v]) => v !== undefined),
      ),
    };
    const [row] = await tx
      .insert(cases)
      .values({
        reference: newCaseReference(),
        customerId: customer!.id,
        addressLine1: a.addressLine1,
        addressLine2: a.addressLine2,
        town: a.town,
        postcode: a.postcode,
        checklist,
        // Shown to the customer as "from your installer — please check" until confirmed.
        prefilled: Object.keys(checklist.about).map((field) => `about.${field}`),
      })
      .returning();
    await audit(tx, { caseId: row!.id, actorId: admin.id, action: 'case.created', entity: 'case', entityId: row!.id, after: { stage: 'invited', email, note: input.note ?? null } });
    await refreshReadiness(tx, row!.id, settings);
    return { row: row!, customer: customer! };
  });
  const office = await firm();
  const url = await signInLink(email, { days: 7, next: `/my/cases/${created.row.id}` });
  await sendCaseMail({
    caseId: created.row.id,
    kind: 'invitation',
    sentById: admin.id,
    mail: { to: email, ...invitationEmail({ customerName: input.customer.name, firmName: office.name, url, note: input.note }) },
  });
  return created.row;
}
