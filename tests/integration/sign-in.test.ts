import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client, baseUrl, signInWithPassword } from '../helpers/http';
import { linkIn, messagesTo, waitForMessage } from '../helpers/mail';
import { db, schema } from '../helpers/db';
import { createUser } from '../../seeds/factories';
import { TEST_PASSWORD, signInWithLink } from '../helpers/people';

describe('staff sign in with e-mail and password', () => {
  it.each(['admin', 'surveyor'] as const)('%s signs in and gets their role from /api/me', async (role) => {
    const user = await createUser(db, { role, password: TEST_PASSWORD, name: `A ${role}` });
    const client = await signInWithPassword(user.email, TEST_PASSWORD);
    const me = await client.json('/api/me');
    expect(me.status).toBe(200);
    expect(me.body).toEqual({ id: user.id, email: user.email, name: `A ${role}`, role });
    const home = await client.fetch('/home');
    expect(home.headers.get('location')).toBe(role === 'admin' ? '/office' : '/surveys');
  });

  it('stores the password as a bcrypt hash, never in plain text', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    expect(user.passwordHash).not.toContain(TEST_PASSWORD);
    expect(user.passwordHash).toMatch(/^\$2[aby]\$\d{2}\$/);
  });

  it('refuses a wrong password with CredentialsSignin and no session', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    const client = new Client();
    const r = await client.authPost('/api/auth/callback/credentials', { email: user.email, password: 'wrong password', callbackUrl: '/home' });
    expect(r.url).toContain('error=CredentialsSignin');
    expect((await client.json('/api/me')).status).toBe(401);
  });

  it('refuses a deactivated staff account and a customer using a password', async () => {
    const gone = await createUser(db, { role: 'surveyor', password: TEST_PASSWORD, active: false });
    const customer = await createUser(db, { role: 'customer', password: TEST_PASSWORD });
    for (const email of [gone.email, customer.email]) {
      const r = await new Client().authPost('/api/auth/callback/credentials', { email, password: TEST_PASSWORD, callbackUrl: '/home' });
      expect(r.url).toContain('error=CredentialsSignin');
    }
  });

  it('rate-limits repeated wrong passwords for one e-mail with 429', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) {
      const r = await new Client().authPost('/api/auth/callback/credentials', { email: user.email, password: `nope-${i}`, callbackUrl: '/home' });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, 5)).toEqual([200, 200, 200, 200, 200]);
    expect(statuses[5]).toBe(429);
    // Even the right password waits out the window: that is what stops guessing.
    const blocked = await new Client().authPost('/api/auth/callback/credentials', { email: user.email, password: TEST_PASSWORD, callbackUrl: '/home' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
  });
});

describe('customer sign in with an e-mailed link', () => {
  it('sends a link through the fake mail service and signs the customer in once', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Link Person' });
    const client = await signInWithLink(user.email);
    const me = await client.json('/api/me');
    expect(me.body.role).toBe('customer');
    expect(me.body.email).toBe(user.email);
    const message = await waitForMessage(user.email);
    expect(message.subject).toBe('Your Groundwork sign-in link');
    expect(message.html).toContain('Sign in to Groundwork');
  });

  it('refuses a reused link with the Verification error', async () => {
    const user = await createUser(db, { role: 'customer' });
    await signInWithLink(user.email);
    const link = linkIn(await waitForMessage(user.email), baseUrl);
    const again = await new Client().fetch(link);
    expect(again.status).toBe(302);
    expect(again.headers.get('location')).toContain('error=Verification');
  });

  it('refuses an expired link with the Verification error', async () => {
    const user = await createUser(db, { role: 'customer' });
    const client = new Client();
    await client.authPost('/api/auth/signin/nodemailer', { email: user.email, callbackUrl: '/home' });
    const link = linkIn(await waitForMessage(user.email), baseUrl);
    await db
      .update(schema.verificationTokens)
      .set({ expires: new Date(Date.now() - 60_000) })
      .where(eq(schema.verificationTokens.identifier, user.email));
    const res = await client.fetch(link);
    expect(res.headers.get('location')).toContain('error=Verification');
    expect((await client.json('/api/me')).status).toBe(401);
  });

  it('sends nothing to an address that is not a customer, yet answers the same way', async () => {
    const staff = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    const stranger = `nobody-${Date.now()}@example.org`;
    for (const email of [stranger, staff.email]) {
      const r = await new Client().authPost('/api/auth/signin/nodemailer', { email, callbackUrl: '/home' });
      expect(r.status).toBe(200);
      expect(r.url).toContain('/signin/check-email');
    }
    await new Promise((r) => setTimeout(r, 500));
    expect(await messagesTo(stranger)).toHaveLength(0);
    expect(await messagesTo(staff.email)).toHaveLength(0);
    const [row] = await db.select().from(schema.users).where(eq(schema.users.email, stranger));
    expect(row).toBeUndefined();
  });

  it('rate-limits link requests per e-mail', async () => {
    const user = await createUser(db, { role: 'customer' });
    const statuses: number[] = [];
    for (let i = 0; i < 6; i++) statuses.push((await new Client().authPost('/api/auth/signin/nodemailer', { email: user.email, callbackUrl: '/home' })).status);
    expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
  });
});
