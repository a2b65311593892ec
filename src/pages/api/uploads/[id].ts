import { api, json, notFound } from '@/lib/server/http';
import { requireUser } from '@/lib/server/auth';
import { deleteUpload, findVisibleUpload, uploadResponse } from '@/lib/server/uploads.server';

/** GET /api/uploads/:id[?size=thumb] — the stored file, streamed, to the case's customer and staff. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  const found = await findVisibleUpload(user, ctx.params.id!);
  if (!found) throw notFound('That file');
  return uploadResponse(found.row, ctx.url.searchParams.get('size') === 'thumb' ? 'thumb' : 'full');
});

/** DELETE /api/uploads/:id — the case's customer removes a file the office has not accepted. */
export const DELETE = api(async (ctx) => {
  const user = requireUser(ctx);
  const found = await findVisibleUpload(user, ctx.params.id!);
  if (!found) throw notFound('That file');
  await deleteUpload(user, found.row, found.caseRow);
  return json({ deleted: found.row.id });
});
