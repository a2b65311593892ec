import { and, inArray, notInArray, eq } from 'drizzle-orm';
import { api, HttpError, json, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { inviteCustomer } from '@/lib/server/invites.server';
import { db } from '@/lib/server/db.server';
import { cases, users } from '@/db/schema';
import { inviteImportSchema, inviteSchema, type Invite } from '@/lib/schemas/invite';
import { zodIssuesToFields } from '@/lib/schemas/checklist';

type RowResult = { row: number; ok: boolean; email?: string; fields?: Record<string, string>; id?: string };

/** Each row checked by the same schema as a single invitation, plus duplicates in the file and in the database. */
async function checkRows(rows: unknown[]): Promise<{ results: RowResult[]; valid: { row: number; invite: Invite }[] }> {
  const results: RowResult[] = [];
  const valid: { row: number; invite: Invite }[] = [];
  const seen = new Map<string, number>();
  for (const [i, raw] of rows.entries()) {
    const parsed = inviteSchema.safeParse(raw);
    if (!parsed.success) {
      results.push({ row: i + 1, ok: false, fields: zodIssuesToFields(parsed.error) });
      continue;
    }
    const email = parsed.data.customer.email;
    if (seen.has(email)) {
      results.push({ row: i + 1, ok: false, email, fields: { 'customer.email': `Same e-mail as row ${seen.get(email)}.` } });
      continue;
    }
    seen.set(email, i + 1);
    results.push({ row: i + 1, ok: true, email });
    valid.push({ row: i + 1, invite: parsed.data });
  }
  const emails = valid.map((v) => v.invite.customer.email);
  if (emails.length) {
    const taken = await db().select({ email: users.email, role: users.role }).from(users).where(inArray(users.email, emails));
    const blocked = new Map<string, string>();
    for (const t of taken) {
      if (t.role !== 'customer') blocked.set(t.email, 'This address belongs to a member of staff.');
    }
    const open = await db()
      .select({ email: users.email })
      .from(cases)
      .innerJoin(users, eq(users.id, cases.customerId))
      .where(and(inArray(users.email, emails), notInArray(cases.stage, ['surveyed', 'withdrawn'])));
    for (const o of open) blocked.set(o.email, 'Already has an open case.');
    for (const r of results) {
      if (r.ok && r.email && blocked.has(r.email)) Object.assign(r, { ok: false, fields: { 'customer.email': blocked.get(r.email) } });
    }
  }
  return { results, valid: valid.filter((v) => results[v.row - 1]!.ok) };
}

/** POST /api/cases/import — bulk invitations: a dry run previews per-row errors; nothing is created unless every row is fine. */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const body = await parseJsonBody(ctx.request, inviteImportSchema);
  const { results, valid } = await checkRows(body.rows);
  const bad = results.filter((r) => !r.ok).length;
  if (body.dryRun) return json({ dryRun: true, ok: bad === 0, results });
  if (bad > 0) throw new HttpError(422, 'invalid', `${bad} of ${results.length} rows need fixing; nothing was created.`, undefined, { results });
  for (const v of valid) {
    const created = await inviteCustomer(admin, v.invite);
    results[v.row - 1]!.id = created.id;
  }
  return json({ dryRun: false, ok: true, created: valid.length, results }, 201);
});
