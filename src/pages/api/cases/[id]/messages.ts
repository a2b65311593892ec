import { api, json, notFound } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { listMessages } from '@/lib/server/case-records.server';

/** GET /api/cases/:id/messages — e-mails and texts about the case together, newest first, with their status (office: with text and recipient; surveyor: kind, subject, status). */
export const GET = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json({ items: await listMessages(row.id, { withText: user.role === 'admin' }) });
});
