import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { recordOutcome } from '@/lib/server/outcome.server';
import { outcomeSchema } from '@/lib/schemas/outcome';

/** POST /api/cases/:id/outcome — the assigned surveyor (or the office) records the visit; 409 unless Survey booked. */
export const POST = api(async (ctx) => {
  const user = requireRole(ctx, 'surveyor', 'admin');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const body = await parseJsonBody(ctx.request, outcomeSchema);
  return json(await recordOutcome(user, row, body));
});
