import { api, HttpError, json, notFound, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { saveChecklist } from '@/lib/server/checklist.server';
import { checklistPatchSchema } from '@/lib/schemas/checklist';

/** The optional If-Match header carries the version the client last saw. */
function ifMatchVersion(request: Request): number | null {
  const raw = request.headers.get('if-match');
  if (raw === null) return null;
  const version = Number(raw.replace(/^W\//, '').replace(/"/g, ''));
  if (!Number.isInteger(version) || version < 1) {
    throw new HttpError(400, 'bad_request', 'If-Match must be the version number of the case, e.g. "3".', { 'If-Match': 'Not a version number.' });
  }
  return version;
}

/** PATCH /api/cases/:id/checklist — merge any subset of answers; nothing is saved if any is invalid. */
export const PATCH = api(async (ctx) => {
  const user = requireRole(ctx, 'customer', 'admin');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const version = ifMatchVersion(ctx.request);
  const patch = await parseJsonBody(ctx.request, checklistPatchSchema);
  return json(await saveChecklist(user, row, patch, version));
});
