// Server-only: staff accounts — invite (with a set-your-password link), deactivate, set password.
import { withArticle } from '@/lib/grammar';
import { createHash, randomBytes } from 'node:crypto';
import { and, asc, eq, gt, inArray } from 'drizzle-orm';
import { users, verificationTokens } from '@/db/schema';
import { audit } from './audit.server';
import { config } from './config.server';
import { db } from './db.server';
import { staffWelcomeEmail } from './email-templates.server';
import { HttpError } from './http';
import { sendMail } from './mail.server';
import { hashPassword } from './passwords.server';
import { endAllSessions } from './sessions.server';
import type { SessionUser } from './users.server';

const hashToken = (token: string) => createHash('sha256').update(`${token}${config.authSecret}`).digest('hex');
const identifierFor = (email: string) => `password:${email}`;

export async function listStaff() {
  return db()
    .select({ id: users.id, name: users.name, email: users.email, role: users.role, active: users.active, createdAt: users.createdAt })
    .from(users)
    .where(inArray(users.role, ['admin', 'surveyor']))
    .orderBy(asc(users.name));
}

/** Active surveyors, for the "book a survey" picker and the queue's filter. */
export async function listSurveyors() {
  return db()
    .select({ id: users.id, name: users.name, email: users.email })
    .from(users)
    .where(and(eq(users.role, 'surveyor'), eq(users.active, true)))
    .orderBy(asc(users.name));
}

export async function inviteStaff(admin: SessionUser, input: { name: string; email: string; role: 'admin' | 'surveyor' }) {
  const [existing] = await db().select().from(users).where(eq(users.email, input.email));
  if (existing) throw new HttpError(409, 'conflict', `${input.email} already has an account.`, { email: 'Already has an account.' });
  const [user] = await db().insert(users).values({ ...input, role: input.role }).returning();
  await audit(db(), { actorId: admin.id, action: 'user.created', entity: 'user', entityId: user!.id, after: { email: input.email, role: input.role } });
  const token = randomBytes(32).toString('hex');
  await db()
    .insert(verificationTokens)
    .values({ identifier: identifierFor(input.email), token: hashToken(token), expires: new Date(Date.now() + 7 * 86_400_000) });
  const url = `${config.appUrl}/set-password?${new URLSearchParams({ email: input.email, token })}`;
  await sendMail({ to: input.email, ...staffWelcomeEmail({ name: input.name, adminName: admin.name ?? null, role: input.role, url }) });
  return user!;
}

/** Uses a one-time token to set a staff password. */
export async function setPasswordWithToken(email: string, token: string, password: string) {
  const identifier = identifierFor(email.toLowerCase());
  const [row] = await db()
    .delete(verificationTokens)
    .where(and(eq(verificationTokens.identifier, identifier), eq(verificationTokens.token, hashToken(token)), gt(verificationTokens.expires, new Date())))
    .returning();
  if (!row) throw new HttpError(400, 'bad_request', 'This link has expired or has already been used. Ask an admin to invite you again.');
  const [user] = await db()
    .update(users)
    .set({ passwordHash: await hashPassword(password) })
    .where(and(eq(users.email, email.toLowerCase()), inArray(users.role, ['admin', 'surveyor'])))
    .returning();
  if (!user) throw new HttpError(400, 'bad_request', 'That staff account no longer exists.');
  // A new password ends sessions signed in with the old one.
  await endAllSessions(user.id);
  await audit(db(), { actorId: user.id, action: 'user.password_set', entity: 'user', entityId: user.id });
}

export async function setStaffActive(admin: SessionUser, id: string, active: boolean) {
  if (id === admin.id && !active) throw new HttpError(409, 'conflict', 'You cannot deactivate your own account.');
  const [before] = await db().select().from(users).where(and(eq(users.id, id), inArray(users.role, ['admin', 'surveyor'])));
  if (!before) throw new HttpError(404, 'not_found', 'That staff account was not found.');
  const [user] = await db().update(users).set({ active }).where(eq(users.id, id)).returning();
  // Deactivation ends every session at once; reactivating does not bring the old ones back.
  if (!active) await endAllSessions(id);
  await audit(db(), { actorId: admin.id, action: active ? 'user.activated' : 'user.deactivated', entity: 'user', entityId: id, before: { active: before.active }, after: { active } });
  return { id: user!.id, name: user!.name, email: user!.email, role: user!.role, active: user!.active };
}
