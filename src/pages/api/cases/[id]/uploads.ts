import { api, HttpError, json, notFound } from '@/lib/server/http';
import { requireRole, requireUser } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { listUploads, receiveUpload } from '@/lib/server/uploads.server';
import { uploadKindSchema } from '@/lib/schemas/uploads';

/** GET /api/cases/:id/uploads[?kind=meter_photo] — the case's uploads, oldest first. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const kindParam = ctx.url.searchParams.get('kind');
  const kind = kindParam === null ? undefined : uploadKindSchema.safeParse(kindParam);
  if (kind && !kind.success) throw new HttpError(400, 'bad_request', 'Unknown kind of upload.', { kind: 'Not a kind of upload.' });
  return json({ items: await listUploads(row.id, kind?.data) });
});

/** POST /api/cases/:id/uploads — multipart `kind` + `file`; 201 with the stored upload. */
export const POST = api(async (ctx) => {
  // The customer, the office, and the assigned surveyor (photos from site) may send files.
  const user = requireRole(ctx, 'customer', 'admin', 'surveyor');
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const item = await receiveUpload(user, row, ctx.request);
  return json(item, 201, { Location: item.url });
});
