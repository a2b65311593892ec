import { describe, expect, it } from 'vitest';
import { RateLimiter } from '../../src/lib/server/rate-limit.server';

// Fixed-window counting (common practice for sign-in throttling; no published source).
describe('RateLimiter', () => {
  it('allows up to the limit in a window, then refuses until the window ends', () => {
    const limiter = new RateLimiter(3, 60_000);
    const t0 = 1_000_000;
    for (let i = 0; i < 3; i++) {
      expect(limiter.allows('a', t0 + i)).toBe(true);
      limiter.hit('a', t0 + i);
    }
    expect(limiter.allows('a', t0 + 10)).toBe(false);
    expect(limiter.retryAfterSeconds('a', t0 + 10)).toBe(60);
    expect(limiter.allows('b', t0 + 10)).toBe(true);
    expect(limiter.allows('a', t0 + 60_000)).toBe(true);
  });
});
