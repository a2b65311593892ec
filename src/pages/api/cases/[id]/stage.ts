import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { moveStage } from '@/lib/server/stages.server';
import { stageMoveSchema } from '@/lib/schemas/office';

/** POST /api/cases/:id/stage — move the case along (admin); 409 lists the moves allowed. */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const row = await findVisibleCase(admin, ctx.params.id!);
  if (!row) throw notFound('That case');
  const move = await parseJsonBody(ctx.request, stageMoveSchema);
  return json(await moveStage(admin, row, move));
});
