// The rate limiter counts in PostgreSQL: atomic under concurrency, shared by every instance (so by
// every app process), windowed, and pruned. Fixed windows are common practice for throttling —
// no published source.
import { describe, expect, it } from 'vitest';
import { eq, like } from 'drizzle-orm';
import { db, schema } from '../helpers/db';
import { RateLimiter, pruneRateLimits } from '@/lib/server/rate-limit.server';

const unique = () => `t${Date.now()}-${Math.random().toString(36).slice(2, 8)}`;

describe('RateLimiter (PostgreSQL)', () => {
  it('allows up to the limit in a window, then refuses with a Retry-After inside the window', async () => {
    const limiter = new RateLimiter(unique(), 3, 60_000);
    const results = [];
    for (let i = 0; i < 4; i++) results.push(await limiter.hit('a'));
    expect(results.map((r) => r.allowed)).toEqual([true, true, true, false]);
    expect(results[3]!.retryAfterSeconds).toBeGreaterThan(55);
    expect(results[3]!.retryAfterSeconds).toBeLessThanOrEqual(60);
    expect((await limiter.hit('b')).allowed).toBe(true);
  });

  it('counts concurrent hits exactly once each (one atomic upsert per hit)', async () => {
    const limiter = new RateLimiter(unique(), 10, 60_000);
    const results = await Promise.all(Array.from({ length: 25 }, () => limiter.hit('same')));
    expect(results.map((r) => r.count).sort((a, b) => a - b)).toEqual(Array.from({ length: 25 }, (_, i) => i + 1));
    expect(results.filter((r) => r.allowed)).toHaveLength(10);
  });

  it('shares counts between instances, as between two app processes or across a restart', async () => {
    const name = unique();
    const before = new RateLimiter(name, 5, 60_000);
    for (let i = 0; i < 5; i++) await before.hit('k');
    const afterRestart = new RateLimiter(name, 5, 60_000);
    expect((await afterRestart.hit('k')).allowed).toBe(false);
  });

  it('starts a new window once the old one has passed', async () => {
    const limiter = new RateLimiter(unique(), 1, 1_000);
    expect((await limiter.hit('w')).allowed).toBe(true);
    expect((await limiter.hit('w')).allowed).toBe(false);
    await new Promise((r) => setTimeout(r, 1_100));
    const fresh = await limiter.hit('w');
    expect(fresh).toMatchObject({ allowed: true, count: 1 });
  });

  it('prunes windows that ended long ago and keeps current ones', async () => {
    const name = unique();
    await db.insert(schema.rateLimits).values([
      { key: `${name}:old`, windowStart: new Date(Date.now() - 2 * 86_400_000), count: 3 },
      { key: `${name}:new`, windowStart: new Date(), count: 1 },
    ]);
    expect(await pruneRateLimits()).toBeGreaterThanOrEqual(1);
    const left = await db.select().from(schema.rateLimits).where(like(schema.rateLimits.key, `${name}:%`));
    expect(left.map((r) => r.key)).toEqual([`${name}:new`]);
    await db.delete(schema.rateLimits).where(eq(schema.rateLimits.key, `${name}:new`));
  });
});
