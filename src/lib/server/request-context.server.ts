// Server-only: what one request carries beyond Astro's context, for code that runs deep inside
// Auth.js (the credentials check, the link sender) and has no Astro context of its own.
// The middleware opens it per request (AsyncLocalStorage); Auth.js callbacks read it.
import { AsyncLocalStorage } from 'node:async_hooks';
import { isIP } from 'node:net';

export type Refusal = { retryAfterSeconds: number };
export type RequestState = {
  /** The client's address as far as we can trust it (see clientAddressOf). */
  clientAddress: string;
  /** Set by a limit that refused the attempt; the middleware answers 429 instead. */
  refusal?: Refusal;
};

const store = new AsyncLocalStorage<RequestState>();

export function runWithRequestState<T>(state: RequestState, work: () => Promise<T>): Promise<T> {
  return store.run(state, work);
}

/** The current request's state; outside a request (scripts, jobs) a fixed placeholder. */
export function requestState(): RequestState {
  return store.getStore() ?? { clientAddress: 'no-request' };
}

/** Marks the current request as refused by a limit: it is answered 429 whatever the handler says. */
export function refuseRequest(retryAfterSeconds: number): void {
  const state = store.getStore();
  if (state) state.refusal = { retryAfterSeconds: Math.max(state.refusal?.retryAfterSeconds ?? 0, retryAfterSeconds) };
}

const normalise = (address: string) => address.trim().replace(/^::ffff:/i, '').toLowerCase();

/** TRUST_PROXY: comma-separated addresses of the reverse proxies in front of the app. */
export function trustedProxies(raw = process.env.TRUST_PROXY ?? ''): Set<string> {
  return new Set(
    raw
      .split(',')
      .map(normalise)
      .filter((a) => a !== ''),
  );
}

/**
 * The address to count a client's attempts against.
 *
 * - `peer` is the socket's address when the server knows it; Astro's own `clientAddress` is the
 *   socket address only when no X-Forwarded-For came in (it prefers the header).
 * - X-Forwarded-For counts only when TRUST_PROXY names the proxy: then the right-most address in
 *   it that is not a trusted proxy is the client (everything left of that the client wrote).
 * - Without TRUST_PROXY, a request carrying the header is counted under one shared key: a
 *   browser talking to us directly never sends it, so forging it only joins a common bucket.
 *
 * @example clientAddressOf(new Headers({ 'x-forwarded-for': '203.0.113.9' }), '203.0.113.9', undefined, new Set()) // 'forwarded-untrusted'
 */
export function clientAddressOf(headers: Headers, astroAddress: string | undefined, peer: string | undefined, trusted = trustedProxies()): string {
  const forwarded = headers.get('x-forwarded-for');
  if (!forwarded) return normalise(peer ?? astroAddress ?? 'unknown');
  if (peer && !trusted.has(normalise(peer))) return normalise(peer);
  if (trusted.size === 0) return 'forwarded-untrusted';
  const chain = forwarded.split(',').map(normalise).filter(Boolean);
  for (let i = chain.length - 1; i >= 0; i--) {
    const hop = chain[i]!;
    if (!trusted.has(hop)) return isIP(hop) ? hop : 'forwarded-invalid';
  }
  return chain[0] ?? 'unknown';
}
