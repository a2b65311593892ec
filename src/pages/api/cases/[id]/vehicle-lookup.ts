import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { lookupForCase } from '@/lib/server/vehicle-lookup.server';
import { vehicleLookupSchema } from '@/lib/schemas/vehicle-lookup';

/** POST /api/cases/:id/vehicle-lookup — `{ registration }` → `{ status: found | not_found | unavailable | off, vehicle?, advice? }`. */
export const POST = api(async (ctx) => {
  const user = requireRole(ctx, 'customer', 'admin');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const { registration } = await parseJsonBody(ctx.request, vehicleLookupSchema);
  return json(await lookupForCase(user, row, registration));
});
