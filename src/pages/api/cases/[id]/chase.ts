import { api, json, notFound } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { chaseFromOffice } from '@/lib/server/chase.server';

/** POST /api/cases/:id/chase — e-mail the customer exactly what is missing (admin). */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const row = await findVisibleCase(admin, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json(await chaseFromOffice(row, admin.id));
});
