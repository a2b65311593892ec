// Sign-in limits hold whatever URL spelling reaches Auth.js, whatever X-Forwarded-For says, and
// across processes: the counts live in PostgreSQL (rate_limits), so this test process, acting as
// a second app process, sees and adds to the counts the server made.
import { describe, expect, it } from 'vitest';
import { like } from 'drizzle-orm';
import { Client, baseUrl } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { createUser } from '../../seeds/factories';
import { TEST_PASSWORD } from '../helpers/people';
import { signInLimits } from '@/lib/server/rate-limit.server';

const PASSWORD = '/api/auth/callback/credentials';
const LINK = '/api/auth/signin/nodemailer';
// Auth.js answers these spellings of the same routes too (found by trying them).
const variants = (path: string) => [`${baseUrl}${path}/`, `${baseUrl}${path}?again=1`, `${baseUrl}${path}/?x=/`];
// Doubled slashes never reach Auth.js at all (it would fail on them with a 500): 404 from our
// middleware, or Astro's own 308 to the single-slash spelling, which is counted like the rest.
const doubled = (path: string) => [`${baseUrl}/${path}`, `${baseUrl}${path}//`, `${baseUrl}${path.replace('/auth/', '/auth//')}`];

const wrong = (email: string, path = PASSWORD, headers: Record<string, string> = {}) =>
  new Client().authPost(path, { email, password: 'not the password', callbackUrl: '/home' }, headers);

describe('password limits are counted inside the credentials check', () => {
  it('refuses the sixth wrong password on every spelling of the route', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    for (let i = 0; i < 5; i++) expect((await wrong(user.email)).status).toBe(200);
    for (const path of variants(PASSWORD)) {
      const r = await wrong(user.email, path);
      expect(r.status, path).toBe(429);
      expect(r.body.error.code).toBe('rate_limited');
    }
    for (const path of doubled(PASSWORD)) expect([404, 308], path).toContain((await wrong(user.email, path)).status);
    // An upper-case e-mail is the same account, so the same count.
    expect((await wrong(user.email.toUpperCase())).status).toBe(429);
  });

  it('keeps the count in PostgreSQL, shared with every other process', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    for (let i = 0; i < 4; i++) await wrong(user.email);
    // This test process reads the server's count…
    expect((await signInLimits.passwordPerEmail.peek(user.email)).count).toBe(4);
    // …and, as a second app process would, counts one more: the server's next attempt is over.
    expect((await signInLimits.passwordPerEmail.hit(user.email)).allowed).toBe(true);
    expect((await new Client().authPost(PASSWORD, { email: user.email, password: TEST_PASSWORD, callbackUrl: '/home' })).status).toBe(429);
  });

  it('does not count a right password against the e-mail', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    for (let i = 0; i < 6; i++) {
      const r = await new Client().authPost(PASSWORD, { email: user.email, password: TEST_PASSWORD, callbackUrl: '/home' });
      expect(r.status).toBe(200);
      expect(r.url).not.toContain('error=');
    }
    expect((await signInLimits.passwordPerEmail.peek(user.email)).count).toBe(0);
  });

  it('counts a forged X-Forwarded-For under the real peer, never under the forged address', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    const forged = Array.from({ length: 3 }, (_, i) => `198.51.100.${10 + i}`);
    // No TRUST_PROXY in the test stack, and the server knows the socket's address: every forged
    // header is counted under the address the requests really came from (this machine).
    const peer = new URL(baseUrl).hostname;
    const before = (await signInLimits.passwordPerAddress.peek(peer)).count;
    for (const address of forged) await wrong(user.email, PASSWORD, { 'x-forwarded-for': address });
    const keys = await db.select().from(schema.rateLimits).where(like(schema.rateLimits.key, 'password-address:%'));
    expect(keys.map((k) => k.key).filter((k) => forged.some((f) => k.includes(f)) || k.endsWith(':forwarded-untrusted'))).toEqual([]);
    // Other test files may sign in from this machine at the same moment, so at least three more.
    expect((await signInLimits.passwordPerAddress.peek(peer)).count - before).toBeGreaterThanOrEqual(3);
    // And forging a fresh address per request does not reset the per-e-mail count either.
    await wrong(user.email, PASSWORD, { 'x-forwarded-for': '198.51.100.99' });
    await wrong(user.email, PASSWORD, { 'x-forwarded-for': '198.51.100.98' });
    expect((await wrong(user.email, PASSWORD, { 'x-forwarded-for': '198.51.100.97' })).status).toBe(429);
  });
});

describe('link limits are counted in the sender', () => {
  it('mails no sixth link to one address, whatever the route spelling', async () => {
    const user = await createUser(db, { role: 'customer' });
    const ask = (path = LINK) => new Client().authPost(path, { email: user.email, callbackUrl: '/home' });
    for (let i = 0; i < 5; i++) expect((await ask()).status).toBe(200);
    for (const path of variants(LINK)) expect((await ask(path)).status, path).toBe(429);
    for (const path of doubled(LINK)) expect([404, 308], path).toContain((await ask(path)).status);
    await new Promise((r) => setTimeout(r, 300));
    expect(await messagesTo(user.email)).toHaveLength(5);
  });

  it('builds the link from APP_URL, not from a Host or X-Forwarded-Host the client sent', async () => {
    const user = await createUser(db, { role: 'customer' });
    const r = await new Client().authPost(LINK, { email: user.email, callbackUrl: 'https://evil.example/phish' }, {
      'x-forwarded-host': 'evil.example',
    });
    expect(r.status).toBe(200);
    await new Promise((r) => setTimeout(r, 300));
    const [message] = await messagesTo(user.email);
    const links = message!.text.match(/https?:\/\/\S+/g) ?? [];
    expect(links.length).toBeGreaterThan(0);
    for (const link of links) {
      expect(link.startsWith(`${baseUrl}/`)).toBe(true);
      expect(decodeURIComponent(link)).not.toContain('evil.example');
    }
  });
});
