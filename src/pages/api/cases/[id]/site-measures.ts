import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { recordSiteMeasures } from '@/lib/server/site-measures.server';
import { siteMeasuresSchema } from '@/lib/schemas/outcome';

/** PUT /api/cases/:id/site-measures — the office or surveyor records a measured maximum demand, the earthing measure, RA or IΔn. */
export const PUT = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const body = await parseJsonBody(ctx.request, siteMeasuresSchema);
  return json(await recordSiteMeasures(user, row, body));
});
