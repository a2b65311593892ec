import { api, notFound } from '@/lib/server/http';
import { requireUser } from '@/lib/server/auth';
import { findPackCase, gatherPack } from '@/lib/server/pack.server';
import { packFileName, packPdf } from '@/lib/server/pack-pdf.server';

/** GET /api/cases/:id/pack.pdf — the survey pack as a PDF, for the office and the assigned surveyor. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  const row = await findPackCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  const pdf = await packPdf(await gatherPack(row));
  return new Response(new Uint8Array(pdf), {
    status: 200,
    headers: {
      'Content-Type': 'application/pdf',
      'Content-Length': String(pdf.length),
      'Content-Disposition': `attachment; filename="${packFileName(row.reference)}"`,
      'Cache-Control': 'private, no-store',
      'X-Content-Type-Options': 'nosniff',
    },
  });
});
