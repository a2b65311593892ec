import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleUpload } from '@/lib/server/uploads.server';
import { reviewUpload } from '@/lib/server/review.server';
import { reviewSchema } from '@/lib/schemas/office';

/** POST /api/uploads/:id/review — accept, or reject with a reason the customer is e-mailed (admin). */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const found = await findVisibleUpload(admin, ctx.params.id!);
  if (!found) throw notFound('That upload');
  const { decision, reason } = await parseJsonBody(ctx.request, reviewSchema);
  return json(await reviewUpload(admin, found.row, found.caseRow, decision, reason));
});
