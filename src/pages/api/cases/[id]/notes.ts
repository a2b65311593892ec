import { api, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { addNote, listNotes } from '@/lib/server/case-records.server';
import { noteSchema } from '@/lib/schemas/office';

/** GET /api/cases/:id/notes — office notes, oldest first (staff). */
export const GET = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  return json({ items: await listNotes(row.id) });
});

/** POST /api/cases/:id/notes — add a note (staff). */
export const POST = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const { body } = await parseJsonBody(ctx.request, noteSchema);
  return json(await addNote(user, row.id, body), 201);
});
