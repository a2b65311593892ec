// Server-only: the office queue — filter, search, sort and paginate cases in SQL, never in memory.
import { and, asc, desc, eq, inArray, isNull, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { cases, uploads, users } from '@/db/schema';
import type { QueueItem, QueueQuery, QueueSortKey } from '@/lib/schemas/queue';
import { db } from './db.server';
import { searchPattern } from '@/db/search-text';
import type { SessionUser } from './users.server';

const surveyors = alias(users, 'surveyor');
const deliveryDate = sql<string | null>`(${cases.checklist} -> 'vehicle' ->> 'deliveryDate')`;
// A flagged photo counts until the office accepts or rejects it (uploads_case_idx finds a case's rows).
const flaggedWaiting = sql`${uploads.caseId} = ${cases.id} and ${uploads.qualityOk} = false and ${uploads.status} = 'waiting'`;

const sortColumns: Record<QueueSortKey, SQL | ReturnType<typeof sql>> = {
  customer: sql`lower(${users.name})`,
  address: sql`lower(${cases.addressLine1})`,
  light: sql`${cases.readinessRank}`,
  gaps: sql`${cases.readinessGaps}`,
  stage: sql`${cases.stage}`,
  invited: sql`${cases.invitedAt}`,
  activity: sql`${cases.lastCustomerActivityAt}`,
  delivery: deliveryDate,
  surveyor: sql`lower(${surveyors.name})`,
  survey: sql`${cases.surveyDate}`,
};

/** The WHERE clause for a query, scoped to what this member of staff may see. */
function where(user: SessionUser, q: QueueQuery): SQL | undefined {
  const parts: (SQL | undefined)[] = [];
  if (user.role === 'surveyor') parts.push(eq(cases.surveyorId, user.id));
  if (q.light?.length) parts.push(inArray(cases.readinessLight, q.light));
  if (q.stage?.length) parts.push(inArray(cases.stage, q.stage));
  if (q.surveyor === 'none') parts.push(isNull(cases.surveyorId));
  else if (q.surveyor) parts.push(eq(cases.surveyorId, q.surveyor));
  if (q.deliveryWithin !== undefined) {
    parts.push(sql`${deliveryDate} <= to_char((now() at time zone 'Europe/London')::date + ${q.deliveryWithin}::int, 'YYYY-MM-DD')`);
  }
  if (q.photos === 'flagged') parts.push(sql`exists (select 1 from ${uploads} where ${flaggedWaiting})`);
  if (q.q) {
    // The postcode sits in search_text without its space, so try the term both ways.
    const squeezed = q.q.replace(/\s+/g, '');
    parts.push(
      or(
        sql`${cases.searchText} like ${searchPattern(q.q)}`,
        squeezed !== q.q ? sql`${cases.searchText} like ${searchPattern(squeezed)}` : undefined,
      ),
    );
  }
  return and(...parts);
}

const columns = {
  id: cases.id,
  reference: cases.reference,
  customerName: users.name,
  customerEmail: users.email,
  addressLine1: cases.addressLine1,
  town: cases.town,
  postcode: cases.postcode,
  light: cases.readinessLight,
  gapCount: cases.readinessGaps,
  gaps: sql<string[]>`coalesce(jsonb_path_query_array(${cases.readinessChecks}, '$[*] ? (@.light != "green").title'), '[]'::jsonb)`,
  stage: cases.stage,
  invitedAt: cases.invitedAt,
  daysSinceInvite: sql<number>`(extract(epoch from now() - ${cases.invitedAt}) / 86400)::int`,
  lastCustomerActivityAt: cases.lastCustomerActivityAt,
  deliveryDate,
  surveyorId: cases.surveyorId,
  surveyorName: surveyors.name,
  surveyDate: cases.surveyDate,
  changedSinceReadyAt: cases.changedSinceReadyAt,
  flaggedPhotos: sql<number>`(select count(*)::int from ${uploads} where ${flaggedWaiting})`,
  total: sql<number>`count(*) over ()`,
};

type Row = { [K in Exclude<keyof typeof columns, 'total'>]: unknown };

function toItem(r: Row): QueueItem {
  const iso = (d: unknown) => (d instanceof Date ? d.toISOString() : (d as string | null));
  return { ...(r as unknown as QueueItem), invitedAt: iso(r.invitedAt)!, lastCustomerActivityAt: iso(r.lastCustomerActivityAt), changedSinceReadyAt: iso(r.changedSinceReadyAt) };
}

/**
 * The one query behind a queue page: its rows, each carrying the total as a window count (one
 * round trip). `npm run bench` runs its SQL (`.toSQL()`) straight through postgres.js too.
 * @example const { sql, params } = queuePageQuery(admin, query).toSQL();
 */
export function queuePageQuery(user: SessionUser, q: QueueQuery) {
  const order = q.dir === 'desc' ? desc : asc;
  const sortKey = sortColumns[q.sort];
  return db()
    .select(columns)
    .from(cases)
    .innerJoin(users, eq(users.id, cases.customerId))
    .leftJoin(surveyors, eq(surveyors.id, cases.surveyorId))
    .where(where(user, q))
    .orderBy(sql`${order(sortKey as SQL)} nulls last`, desc(cases.invitedAt), asc(cases.id))
    .limit(q.pageSize)
    .offset((q.page - 1) * q.pageSize);
}

/**
 * One page of the queue plus the total matching.
 * @example await queuePage(admin, queueQuerySchema.parse({ light: 'red', sort: 'invited', dir: 'desc' }))
 */
export async function queuePage(user: SessionUser, q: QueueQuery): Promise<{ items: QueueItem[]; total: number; page: number; pageSize: number }> {
  const filter = where(user, q);
  const rows = await queuePageQuery(user, q);
  let total = rows[0] ? Number(rows[0].total) : 0;
  if (rows.length === 0 && q.page > 1) {
    // Past the last page there is no row to carry the total: count separately.
    const [count] = await db()
      .select({ n: sql<number>`count(*)::int` })
      .from(cases)
      .innerJoin(users, eq(users.id, cases.customerId))
      .leftJoin(surveyors, eq(surveyors.id, cases.surveyorId))
      .where(filter);
    total = count?.n ?? 0;
  }
  return { items: rows.map(({ total: _t, ...r }) => toItem(r)), total, page: q.page, pageSize: q.pageSize };
}

/** Every matching row for the CSV export, streamed a page at a time. */
export async function* queueRows(user: SessionUser, q: QueueQuery): AsyncGenerator<QueueItem> {
  for (let page = 1; ; page++) {
    const { items } = await queuePage(user, { ...q, page, pageSize: 200 });
    yield* items;
    if (items.length < 200) return;
  }
}
