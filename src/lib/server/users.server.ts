// Server-only: queries on users (customers and staff).
import { and, eq, sql } from 'drizzle-orm';
import { db } from './db.server';
import { users, type Role, type User } from '@/db/schema';

export type SessionUser = Pick<User, 'id' | 'email' | 'name' | 'role'>;

export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}

export async function findUserByEmail(email: string): Promise<User | undefined> {
  const [row] = await db().select().from(users).where(eq(users.email, normaliseEmail(email))).limit(1);
  return row;
}

/** The signed-in user as the app sees them, or undefined when gone or deactivated. */
export async function findActiveUser(id: string): Promise<SessionUser | undefined> {
  const [row] = await db()
    .select({ id: users.id, email: users.email, name: users.name, role: users.role })
    .from(users)
    .where(and(eq(users.id, id), eq(users.active, true)))
    .limit(1);
  return row;
}

export async function countUsersByRole(role: Role): Promise<number> {
  const [row] = await db().select({ n: sql<number>`count(*)::int` }).from(users).where(eq(users.role, role));
  return row?.n ?? 0;
}
