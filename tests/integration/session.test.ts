// The session cookie, read by the middleware itself: tokens are made here with Auth.js's own
// `encode` (the reference implementation of the cookie format: a JWE, A256CBC-HS512, key from
// HKDF over AUTH_SECRET salted with the cookie name) and sent as a browser would.
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import { encode } from '@auth/core/jwt';
import { baseUrl } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { createUser } from '../../seeds/factories';

const COOKIE = 'authjs.session-token';
const secret = () => {
  const value = process.env.AUTH_SECRET;
  if (!value) throw new Error('AUTH_SECRET is not set: run through `npm test`.');
  return value;
};

async function me(token: string, name = COOKIE) {
  const res = await fetch(new URL('/api/me', baseUrl), { headers: { cookie: `${name}=${token}` } });
  return { status: res.status, body: (await res.json()) as { id?: string; error?: { code: string } } };
}

// The claims the app's own sign-in puts in the token: the user, a session id (so one session can
// be ended) and the user's session version (so all of them can).
const tokenFor = (uid: string, opts: { maxAge?: number; secret?: string; salt?: string; claims?: Record<string, unknown> } = {}) =>
  encode({
    token: opts.claims ?? { uid, role: 'admin', sub: uid, sid: randomUUID(), sv: 0 },
    secret: opts.secret ?? secret(),
    salt: opts.salt ?? COOKIE,
    maxAge: opts.maxAge ?? 3600,
  });

describe('the session cookie', () => {
  it('a token Auth.js made for an active user signs them in, under either cookie name', async () => {
    const user = await createUser(db, { role: 'admin' });
    await expect(me(await tokenFor(user.id))).resolves.toMatchObject({ status: 200, body: { id: user.id } });
    const secureName = '__Secure-authjs.session-token';
    await expect(me(await tokenFor(user.id, { salt: secureName }), secureName)).resolves.toMatchObject({ status: 200, body: { id: user.id } });
  });

  it('refuses an expired token, one made with another secret, one salted for the other name, and a tampered one', async () => {
    const user = await createUser(db, { role: 'admin' });
    // jose allows 15 s of clock skew when checking `exp`, so expire it well before that.
    const expired = await tokenFor(user.id, { maxAge: -60 });
    const otherSecret = await tokenFor(user.id, { secret: 'a-different-secret-of-enough-length-000' });
    const otherSalt = await tokenFor(user.id, { salt: '__Secure-authjs.session-token' });
    const good = await tokenFor(user.id);
    const tampered = good.slice(0, -4) + (good.endsWith('AAAA') ? 'BBBB' : 'AAAA');
    // A token made before sessions carried an id cannot be ended on its own, so it is refused.
    const withoutSession = await tokenFor(user.id, { claims: { uid: user.id, role: 'admin', sub: user.id } });
    for (const token of [expired, otherSecret, otherSalt, tampered, withoutSession, 'not-a-token']) {
      await expect(me(token)).resolves.toMatchObject({ status: 401, body: { error: { code: 'unauthenticated' } } });
    }
  });

  it('a valid token stops working the moment its user is deactivated, even after it was used', async () => {
    const user = await createUser(db, { role: 'admin' });
    const token = await tokenFor(user.id);
    await expect(me(token)).resolves.toMatchObject({ status: 200 });
    await db.update(schema.users).set({ active: false }).where(eq(schema.users.id, user.id));
    await expect(me(token)).resolves.toMatchObject({ status: 401 });
  });
});
