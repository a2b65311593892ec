// Server-only: fixed-window rate limits counted in PostgreSQL (table rate_limits), so every app
// process shares one count and a restart resets nothing. Each count is one atomic upsert.
// Fixed windows are common practice for throttling sign-in (no published source): simple, and
// at most twice the limit can land around a window edge.
import { lt, sql } from 'drizzle-orm';
import { rateLimits } from '@/db/schema';
import { db } from './db.server';
import { refuseRequest, requestState } from './request-context.server';

export type LimitResult = { allowed: boolean; count: number; retryAfterSeconds: number };

/** How often (at most) a process deletes windows that ended; deleting is cheap but not free. */
const PRUNE_EVERY_MS = 60_000;
let lastPrune = 0;

export class RateLimiter {
  constructor(
    /** Part of every key, so two limits never share a counter. */
    readonly name: string,
    readonly limit: number,
    readonly windowMs: number,
  ) {}

  private rowKey(key: string) {
    return `${this.name}:${key}`;
  }

  /**
   * Counts one attempt and says whether it is within the limit. The count, the window's start
   * and the answer come from one statement, so concurrent attempts cannot slip past together.
   * @example const r = await signInLimits.linkPerEmail.hit(email); if (!r.allowed) …
   */
  async hit(key: string): Promise<LimitResult> {
    const windowSecs = this.windowMs / 1000;
    const rows = await db().execute<{ count: number; retry: number }>(sql`
      insert into ${rateLimits} (key, window_start, count) values (${this.rowKey(key)}, now(), 1)
      on conflict (key) do update set
        count = case when ${rateLimits.windowStart} <= now() - make_interval(secs => ${windowSecs}) then 1 else ${rateLimits.count} + 1 end,
        window_start = case when ${rateLimits.windowStart} <= now() - make_interval(secs => ${windowSecs}) then now() else ${rateLimits.windowStart} end
      returning count, ceil(extract(epoch from (window_start + make_interval(secs => ${windowSecs}) - now())))::int as retry`);
    void this.pruneNowAndThen();
    return this.result(rows[0]);
  }

  /** The state of a key without counting (for showing, not for deciding: decide with hit()). */
  async peek(key: string): Promise<LimitResult> {
    const windowSecs = this.windowMs / 1000;
    const rows = await db().execute<{ count: number; retry: number }>(sql`
      select count, ceil(extract(epoch from (window_start + make_interval(secs => ${windowSecs}) - now())))::int as retry
      from ${rateLimits} where key = ${this.rowKey(key)} and window_start > now() - make_interval(secs => ${windowSecs})`);
    return this.result(rows[0] ?? { count: 0, retry: 0 });
  }

  /** Gives back one counted attempt (a right password does not count against its e-mail). */
  async release(key: string): Promise<void> {
    await db().execute(sql`update ${rateLimits} set count = greatest(count - 1, 0) where key = ${this.rowKey(key)}`);
  }

  private result(row: { count: number; retry: number } | undefined): LimitResult {
    const count = Number(row?.count ?? 0);
    const allowed = count <= this.limit;
    return { allowed, count, retryAfterSeconds: allowed ? 0 : Math.max(1, Number(row?.retry ?? 1)) };
  }

  private async pruneNowAndThen() {
    if (Date.now() - lastPrune < PRUNE_EVERY_MS) return;
    lastPrune = Date.now();
    await pruneRateLimits().catch(() => {});
  }
}

/**
 * Deletes windows that ended more than a day ago (every limit's window is shorter than that).
 * @example await pruneRateLimits();
 */
export async function pruneRateLimits(olderThanMs = 86_400_000): Promise<number> {
  const gone = await db()
    .delete(rateLimits)
    .where(lt(rateLimits.windowStart, new Date(Date.now() - olderThanMs)))
    .returning({ key: rateLimits.key });
  return gone.length;
}

const FIFTEEN_MINUTES = 15 * 60 * 1000;
const ONE_HOUR = 60 * 60 * 1000;
const num = (name: string, fallback: number) => Number(process.env[name] ?? fallback);

/** Sign-in limits: failed passwords and e-mailed links, per e-mail address and per client address. */
export const signInLimits = {
  passwordPerEmail: new RateLimiter('password-email', num('RATE_LIMIT_PASSWORD_PER_EMAIL', 5), FIFTEEN_MINUTES),
  passwordPerAddress: new RateLimiter('password-address', num('RATE_LIMIT_PASSWORD_PER_ADDRESS', 50), FIFTEEN_MINUTES),
  linkPerEmail: new RateLimiter('link-email', num('RATE_LIMIT_LINK_PER_EMAIL', 5), FIFTEEN_MINUTES),
  linkPerAddress: new RateLimiter('link-address', num('RATE_LIMIT_LINK_PER_ADDRESS', 100), FIFTEEN_MINUTES),
};

/** Uploads per user per hour: enough for a whole checklist several times over, not for a flood. */
export const uploadRateLimits = {
  perUser: new RateLimiter('upload-user', num('RATE_LIMIT_UPLOADS_PER_HOUR', 60), ONE_HOUR),
};

/**
 * Counts one password attempt for the e-mail and for the client's address, where the attempt
 * happens (inside the credentials check), whatever URL reached it. Over either limit the
 * request is marked refused (answered 429) and the password is not even checked.
 * Call `succeeded()` after a right password: only failures count against an address or e-mail.
 * @example const attempt = await countPasswordAttempt(email); if (!attempt.allowed) return null;
 */
export async function countPasswordAttempt(email: string): Promise<{ allowed: boolean; succeeded: () => Promise<void> }> {
  const address = requestState().clientAddress;
  const [perEmail, perAddress] = await Promise.all([signInLimits.passwordPerEmail.hit(email), signInLimits.passwordPerAddress.hit(address)]);
  const succeeded = async () => {
    await Promise.all([signInLimits.passwordPerEmail.release(email), signInLimits.passwordPerAddress.release(address)]);
  };
  if (perEmail.allowed && perAddress.allowed) return { allowed: true, succeeded };
  refuseRequest(Math.max(perEmail.retryAfterSeconds, perAddress.retryAfterSeconds));
  return { allowed: false, succeeded };
}

/**
 * Counts one sign-in link about to be e-mailed, per address it goes to and per client, in the
 * sender itself. Over either limit nothing is sent and the request is answered 429.
 */
export async function countLinkRequest(email: string): Promise<boolean> {
  const address = requestState().clientAddress;
  const [perEmail, perAddress] = await Promise.all([signInLimits.linkPerEmail.hit(email), signInLimits.linkPerAddress.hit(address)]);
  if (perEmail.allowed && perAddress.allowed) return true;
  refuseRequest(Math.max(perEmail.retryAfterSeconds, perAddress.retryAfterSeconds));
  return false;
}
