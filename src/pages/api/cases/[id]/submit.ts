import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { submitCase } from '@/lib/server/checklist.server';
import { config } from '@/lib/server/config.server';
import { caseSubmittedEmail } from '@/lib/server/email-templates.server';
import { sendCaseMail } from '@/lib/server/case-mail.server';
import { firm } from '@/lib/server/office.server';
import { submitSchema } from '@/lib/schemas/submit';

/** POST /api/cases/:id/submit — the customer sends the case for review; the office is e-mailed. */
export const POST = api(async (ctx) => {
  const user = requireRole(ctx, 'customer');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const body = await parseJsonBody(ctx.request, submitSchema);
  const { view, gaps } = await submitCase(user, row, body.acknowledgeGaps);
  const office = await firm();
  const address = [view.address.addressLine1, view.address.town, view.address.postcode].filter(Boolean).join(', ');
  try {
    await sendCaseMail({
      caseId: view.id,
      kind: 'submitted',
      sentById: user.id,
      mail: {
        to: office.email,
        ...caseSubmittedEmail({ reference: view.reference, customer: user.name ?? user.email, address, gaps, url: `${config.appUrl}/office/cases/${view.id}` }),
      },
    });
  } catch (err) {
    // The case is sent whatever happens to the office's copy of the news; the queue shows it.
    console.error('[submit] could not e-mail the office', err);
  }
  return json(view);
});
