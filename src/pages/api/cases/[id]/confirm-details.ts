import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { confirmDetails } from '@/lib/server/checklist.server';
import { confirmDetailsSchema } from '@/lib/schemas/confirm-details';

/** POST /api/cases/:id/confirm-details — the customer confirms the details the installer filled in. */
export const POST = api(async (ctx) => {
  const user = requireRole(ctx, 'customer');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const body = await parseJsonBody(ctx.request, confirmDetailsSchema);
  return json(await confirmDetails(user, row, body.paths));
});
