import { api, json, notFound } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { listEmails } from '@/lib/server/case-records.server';

/** GET /api/cases/:id/emails — every e-mail sent about the case, newest first (office: with its text; surveyor: kind and subject). */
export const GET = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json({ items: await listEmails(row.id, { withText: user.role === 'admin' }) });
});
