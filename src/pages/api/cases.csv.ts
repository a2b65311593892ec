import Papa from 'papaparse';
import { api, HttpError } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { queueRows } from '@/lib/server/queue.server';
import { queueQueryFromParams } from '@/lib/schemas/queue';
import { zodIssuesToFields } from '@/lib/schemas/checklist';
import { stageLabels } from '@/lib/stages';

const header = ['Reference', 'Customer', 'E-mail', 'Address', 'Town', 'Postcode', 'Readiness', 'Open checks', 'Checks open', 'Stage', 'Invited', 'Days since invite', 'Last customer activity', 'Delivery date', 'Surveyor', 'Survey date', 'Photos flagged'];

/** GET /api/cases.csv — the same filtered, sorted view as the queue, as CSV (staff only). */
export const GET = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  const parsed = queueQueryFromParams(ctx.url.searchParams);
  if (!parsed.success) throw new HttpError(422, 'invalid', 'Some filters are not valid.', zodIssuesToFields(parsed.error));
  const { page: _p, pageSize: _s, ...query } = parsed.data;
  const encoder = new TextEncoder();
  const rows = queueRows(user, { ...query, page: 1, pageSize: 200 });
  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      controller.enqueue(encoder.encode(Papa.unparse([header]) + '\r\n'));
    },
    async pull(controller) {
      const next = await rows.next();
      if (next.done) return controller.close();
      const r = next.value;
      const line = [
        r.reference, r.customerName ?? '', r.customerEmail, r.addressLine1 ?? '', r.town ?? '', r.postcode ?? '', r.light, r.gapCount,
        r.gaps.join('; '), stageLabels[r.stage], r.invitedAt.slice(0, 10), r.daysSinceInvite, r.lastCustomerActivityAt?.slice(0, 10) ?? '',
        r.deliveryDate ?? '', r.surveyorName ?? '', r.surveyDate ?? '', r.flaggedPhotos,
      ];
      // Formula-like cells are prefixed so a spreadsheet never runs them (CSV injection).
      const safe = line.map((v) => (typeof v === 'string' && /^[=+\-@\t\r]/.test(v) ? `'${v}` : v));
      controller.enqueue(encoder.encode(Papa.unparse([safe]) + '\r\n'));
    },
  });
  const stamp = new Date().toISOString().slice(0, 10);
  return new Response(stream, {
    headers: {
      'Content-Type': 'text/csv; charset=utf-8',
      'Content-Disposition': `attachment; filename="groundwork-cases-${stamp}.csv"`,
      'Cache-Control': 'no-store',
    },
  });
});
