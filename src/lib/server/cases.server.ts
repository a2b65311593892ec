// Server-only: queries on cases, always scoped by who is asking.
import { and, desc, eq, sql } from 'drizzle-orm';
import { db } from './db.server';
import { isUuid } from '@/lib/ids';
import { cases, users } from '@/db/schema';
import type { SessionUser } from './users.server';

export const caseSummaryColumns = {
  id: cases.id,
  reference: cases.reference,
  stage: cases.stage,
  addressLine1: cases.addressLine1,
  town: cases.town,
  postcode: cases.postcode,
  surveyDate: cases.surveyDate,
  invitedAt: cases.invitedAt,
  updatedAt: cases.updatedAt,
  customerName: users.name,
  customerEmail: users.email,
};

/** A customer's own cases, newest first. */
export async function listCustomerCases(user: SessionUser) {
  return db()
    .select(caseSummaryColumns)
    .from(cases)
    .innerJoin(users, eq(users.id, cases.customerId))
    .where(eq(cases.customerId, user.id))
    .orderBy(desc(cases.invitedAt));
}

/** The cases assigned to a surveyor, soonest survey first. */
export async function listAssignedCases(user: SessionUser) {
  return db()
    .select(caseSummaryColumns)
    .from(cases)
    .innerJoin(users, eq(users.id, cases.customerId))
    .where(eq(cases.surveyorId, user.id))
    .orderBy(sql`${cases.surveyDate} asc nulls last`);
}

/** Every case, newest first, a page at a time (the office queue grows on this). */
export async function listAllCases({ limit = 50, offset = 0 } = {}) {
  const [items, [count]] = await Promise.all([
    db()
      .select(caseSummaryColumns)
      .from(cases)
      .innerJoin(users, eq(users.id, cases.customerId))
      .orderBy(desc(cases.invitedAt))
      .limit(limit)
      .offset(offset),
    db().select({ n: sql<number>`count(*)::int` }).from(cases),
  ]);
  return { items, total: count?.n ?? 0 };
}

/** One case if this user may see it; undefined otherwise (callers answer 404, never 403). */
export async function findVisibleCase(user: SessionUser, id: string) {
  if (!isUuid(id)) return undefined;
  const scope =
    user.role === 'admin'
      ? eq(cases.id, id)
      : user.role === 'surveyor'
        ? and(eq(cases.id, id), eq(cases.surveyorId, user.id))
        : and(eq(cases.id, id), eq(cases.customerId, user.id));
  const [row] = await db().select().from(cases).where(scope).limit(1);
  return row;
}
