import { api, json, notFound } from '@/lib/server/http';
import { requireUser } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { toCaseView } from '@/lib/server/case-view.server';

/** GET /api/cases/:id — the case with its checklist and progress; 404 unless it is yours to see. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json(toCaseView(row, user.role));
});
