import { api, HttpError, json } from '@/lib/server/http';
import { requireUser } from '@/lib/server/auth';
import { listCustomerCases } from '@/lib/server/cases.server';
import { queuePage } from '@/lib/server/queue.server';
import { queueQueryFromParams } from '@/lib/schemas/queue';
import { zodIssuesToFields } from '@/lib/schemas/checklist';
import { inviteSchema } from '@/lib/schemas/invite';
import { parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { inviteCustomer } from '@/lib/server/invites.server';

/** GET /api/cases — a customer's own cases; for staff, the filtered, sorted, paged queue. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  if (user.role === 'customer') {
    const items = await listCustomerCases(user);
    return json({ items, total: items.length });
  }
  const parsed = queueQueryFromParams(ctx.url.searchParams);
  if (!parsed.success) throw new HttpError(422, 'invalid', 'Some filters are not valid.', zodIssuesToFields(parsed.error));
  return json(await queuePage(user, parsed.data));
});

/** POST /api/cases — the office invites a customer: a case, an account if new, and an e-mail. */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const body = await parseJsonBody(ctx.request, inviteSchema);
  const created = await inviteCustomer(admin, body);
  return json({ id: created.id, reference: created.reference }, 201, { Location: `/api/cases/${created.id}` });
});
