import { api, json, notFound } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { listAudit } from '@/lib/server/case-records.server';

/** GET /api/cases/:id/audit — who changed what, when, newest first (staff). */
export const GET = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json({ items: await listAudit(row.id) });
});
