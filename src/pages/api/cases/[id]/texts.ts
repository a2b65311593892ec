import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole, requireUser } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { giveTextConsent, textConsentView, withdrawTextConsent } from '@/lib/server/text-messages.server';
import { textConsentSchema } from '@/lib/schemas/texts';

/** GET /api/cases/:id/texts — whether texts are on and the case's customer has agreed. */
export const GET = api(async (ctx) => {
  const row = await findVisibleCase(requireUser(ctx), ctx.params.id!);
  if (!row) throw notFound('That case');
  return json(await textConsentView(row.customerId));
});

/** PUT /api/cases/:id/texts — the customer agrees to texts on a UK mobile; only they can. */
export const PUT = api(async (ctx) => {
  const user = requireRole(ctx, 'customer');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const { mobile } = await parseJsonBody(ctx.request, textConsentSchema);
  return json(await giveTextConsent(user.id, row.id, mobile));
});

/** DELETE /api/cases/:id/texts — the customer stops texts at once. */
export const DELETE = api(async (ctx) => {
  const user = requireRole(ctx, 'customer');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json(await withdrawTextConsent(user.id, 'checklist', row.id, user.id));
});
