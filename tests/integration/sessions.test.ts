// Sessions are JWT cookies; these check that the server still ends them: signing out, "sign out
// everywhere", deactivation and a new password each make an old cookie worthless at once.
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { signInWithPassword } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { newCustomer, newStaff, TEST_PASSWORD } from '../helpers/people';

const me = async (client: { json: (p: string) => Promise<{ status: number }> }) => (await client.json('/api/me')).status;

describe('ending sessions', () => {
  it('makes a staff session cookie worthless after signing out', async () => {
    const { client } = await newStaff('admin');
    const stolen = client.copy();
    expect(await me(stolen)).toBe(200);
    expect(await client.signOut()).toBe(200);
    expect(await me(client)).toBe(401);
    expect(await me(stolen)).toBe(401);
    expect((await stolen.fetch('/office')).status).toBe(302);
    // Auth.js's own session route, which reads only the cookie, does not vouch for it either.
    const session = await stolen.fetch('/api/auth/session');
    expect(session.status).toBe(200);
    expect(await session.json()).toBeNull();
  });

  it('describes a standing session on the Auth.js session route', async () => {
    const { client, user } = await newStaff('admin');
    const session = (await (await client.fetch('/api/auth/session')).json()) as { user?: { email?: string } } | null;
    expect(session?.user?.email).toBe(user.email);
  });

  it('makes a customer session cookie worthless after signing out, and leaves their other sessions alone', async () => {
    const { client, user } = await newCustomer();
    const stolen = client.copy();
    expect(await client.signOut()).toBe(200);
    expect(await me(stolen)).toBe(401);
    // Signing out on one device is not "everywhere": a second sign-in still works independently.
    const [row] = await db.select().from(schema.users).where(eq(schema.users.id, user.id));
    expect(row!.sessionVersion).toBe(0);
  });

  it('signs a member of staff out on every device', async () => {
    const { client: laptop, user } = await newStaff('surveyor');
    const phone = await signInWithPassword(user.email, TEST_PASSWORD);
    expect(await me(phone)).toBe(200);
    const r = await laptop.send('POST', '/api/me/sign-out-everywhere', {});
    expect(r.status).toBe(200);
    expect(await me(laptop)).toBe(401);
    expect(await me(phone)).toBe(401);
    const again = await signInWithPassword(user.email, TEST_PASSWORD);
    expect(await me(again)).toBe(200);
  });

  it('is for staff only', async () => {
    const { client } = await newCustomer();
    expect((await client.send('POST', '/api/me/sign-out-everywhere', {})).status).toBe(403);
  });

  it('ends a deactivated account at once, and reactivating does not revive the old cookie', async () => {
    const { client: admin } = await newStaff('admin');
    const { client: surveyor, user } = await newStaff('surveyor');
    expect((await admin.send('PATCH', `/api/staff/${user.id}`, { active: false })).status).toBe(200);
    expect(await me(surveyor)).toBe(401);
    expect((await admin.send('PATCH', `/api/staff/${user.id}`, { active: true })).status).toBe(200);
    expect(await me(surveyor)).toBe(401);
  });
});
