// Server-only: sessions are JWTs in a cookie (docs/decisions), so ending one needs a record on
// the server. Each token carries a session id (sid) and the user's session version (sv):
// signing out lists the sid in revoked_sessions; "sign out everywhere" and deactivation raise
// the version. The user is re-read from PostgreSQL on every request anyway, so both checks ride
// on that one query.
import { randomUUID } from 'node:crypto';
import { and, eq, lt, notExists, sql } from 'drizzle-orm';
import { revokedSessions, users } from '@/db/schema';
import { db, type Tx } from './db.server';
import type { SessionUser } from './users.server';

export type SessionClaims = { uid: string; role: string | undefined; sid: string; sv: number };

/** What a new session token carries about its user. */
export async function newSessionClaims(userId: string): Promise<SessionClaims> {
  const [row] = await db().select({ role: users.role, sv: users.sessionVersion }).from(users).where(eq(users.id, userId));
  return { uid: userId, role: row?.role, sid: randomUUID(), sv: row?.sv ?? 0 };
}

/**
 * The signed-in user for a session token's claims, or undefined when the account is gone or
 * inactive, the session was signed out, or every session was ended after this one began.
 */
export async function findSessionUser(claims: { uid?: unknown; sid?: unknown; sv?: unknown }): Promise<SessionUser | undefined> {
  const { uid, sid, sv } = claims;
  // Tokens made before sessions carried an id cannot be ended one by one: they sign in again.
  if (typeof uid !== 'string' || typeof sid !== 'string' || typeof sv !== 'number') return undefined;
  const [row] = await db()
    .select({ id: users.id, email: users.email, name: users.name, role: users.role })
    .from(users)
    .where(
      and(
        eq(users.id, uid),
        eq(users.active, true),
        eq(users.sessionVersion, sv),
        notExists(db().select({ one: sql`1` }).from(revokedSessions).where(eq(revokedSessions.sessionId, sid))),
      ),
    )
    .limit(1);
  return row;
}

/** Ends one session (sign-out). Kept until the token would have expired anyway. */
export async function revokeSession(token: { sid?: unknown; exp?: unknown }): Promise<void> {
  if (typeof token.sid !== 'string') return;
  const expiresAt = new Date(typeof token.exp === 'number' ? token.exp * 1000 : Date.now() + 14 * 86_400_000);
  await db().insert(revokedSessions).values({ sessionId: token.sid, expiresAt }).onConflictDoNothing();
  await db().delete(revokedSessions).where(lt(revokedSessions.expiresAt, new Date()));
}

/**
 * Ends every session of a user at once: "sign out everywhere", deactivation, a new password.
 * @example await endAllSessions(user.id); // inside a transaction: endAllSessions(id, tx)
 */
export async function endAllSessions(userId: string, tx?: Tx): Promise<void> {
  await (tx ?? db())
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId));
}
