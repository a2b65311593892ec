import { inArray } from 'drizzle-orm';
import { api, json, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { chaseCase } from '@/lib/server/chase.server';
import { db } from '@/lib/server/db.server';
import { cases } from '@/db/schema';
import { bulkChaseSchema } from '@/lib/schemas/office';

/** POST /api/cases/chase — chase every selected case; says which were sent and why not. */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const { caseIds } = await parseJsonBody(ctx.request, bulkChaseSchema);
  const rows = await db().select().from(cases).where(inArray(cases.id, caseIds));
  const results = [];
  for (const row of rows) results.push(await chaseCase(row, { actorId: admin.id }));
  const found = new Set(rows.map((r) => r.id));
  for (const id of caseIds) if (!found.has(id)) results.push({ caseId: id, sent: false, items: [], reason: 'Case not found.' });
  return json({ sent: results.filter((r) => r.sent).length, results });
});
