// Server-only: a fixed-window counter per key, kept in memory. One app process serves
// Groundwork; a shared store (PostgreSQL or Redis) would replace this when it scales out.
type Bucket = { count: number; resetAt: number };

export class RateLimiter {
  private buckets = new Map<string, Bucket>();

  constructor(
    readonly limit: number,
    readonly windowMs: number,
  ) {}

  /** True when the key still has room in its window (does not count). */
  allows(key: string, now = Date.now()): boolean {
    const b = this.buckets.get(key);
    return !b || b.resetAt <= now || b.count < this.limit;
  }

  /** Counts one attempt against the key. */
  hit(key: string, now = Date.now()): void {
    const b = this.buckets.get(key);
    if (!b || b.resetAt <= now) this.buckets.set(key, { count: 1, resetAt: now + this.windowMs });
    else b.count += 1;
    if (this.buckets.size > 50_000) this.prune(now);
  }

  retryAfterSeconds(key: string, now = Date.now()): number {
    const b = this.buckets.get(key);
    return b ? Math.max(1, Math.ceil((b.resetAt - now) / 1000)) : 0;
  }

  private prune(now: number) {
    for (const [k, b] of this.buckets) if (b.resetAt <= now) this.buckets.delete(k);
  }
}

const FIFTEEN_MINUTES = 15 * 60 * 1000;
const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);

/** Sign-in limits: failed passwords and e-mailed links, per e-mail address and per client address. */
export const signInLimits = {
  passwordPerEmail: new RateLimiter(num('RATE_LIMIT_PASSWORD_PER_EMAIL', 5), FIFTEEN_MINUTES),
  passwordPerAddress: new RateLimiter(num('RATE_LIMIT_PASSWORD_PER_ADDRESS', 50), FIFTEEN_MINUTES),
  linkPerEmail: new RateLimiter(num('RATE_LIMIT_LINK_PER_EMAIL', 5), FIFTEEN_MINUTES),
  linkPerAddress: new RateLimiter(num('RATE_LIMIT_LINK_PER_ADDRESS', 100), FIFTEEN_MINUTES),
};
