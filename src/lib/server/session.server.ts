// Server-only: who a request's session belongs to, read straight from the Auth.js session cookie.
// auth-astro's getSession() runs a whole internal Auth.js request per page or API call (build a
// Request, route it, decrypt the JWT, run the callbacks, encrypt a renewed JWT that is then
// thrown away); the middleware needs only the claims inside (user id, session id and version), so
// it decrypts the cookie itself with Auth.js's own `decode` (same key derivation, same expiry check).
import type { AstroCookies } from 'astro';
import { decode } from '@auth/core/jwt';
import { config } from './config.server';

// Auth.js names the cookie by whether the site is served over HTTPS; the name is also the salt.
const COOKIE_NAMES = ['__Secure-authjs.session-token', 'authjs.session-token'] as const;
// Auth.js splits a cookie over 4 KB into name.0, name.1, …; ours are far smaller, but read both ways.
const MAX_CHUNKS = 8;

function cookieValue(cookies: AstroCookies, name: string): string | undefined {
  const whole = cookies.get(name)?.value;
  if (whole) return whole;
  const parts: string[] = [];
  for (let i = 0; i < MAX_CHUNKS; i++) {
    const part = cookies.get(`${name}.${i}`)?.value;
    if (!part) break;
    parts.push(part);
  }
  return parts.length ? parts.join('') : undefined;
}

// A token never changes once issued, so what it decodes to can be kept until it expires: each
// decode costs a key derivation and a decryption, the largest share of a request's own CPU time.
// Bounded, oldest first out; a deactivated user is still stopped by the database read after this.
const DECODED_MAX = 1000;
// A signed-out or ended session is still refused: findSessionUser checks it in PostgreSQL.
const decoded = new Map<string, { claims: SessionTokenClaims | null; expiresAt: number }>();

/** What the middleware needs from a session token. */
export type SessionTokenClaims = { uid: string; sid?: unknown; sv?: unknown };

function remember(token: string, claims: SessionTokenClaims | null, exp: unknown) {
  if (decoded.size >= DECODED_MAX) decoded.delete(decoded.keys().next().value!);
  decoded.set(token, { claims, expiresAt: typeof exp === 'number' ? exp * 1000 : 0 });
}

/**
 * The claims in a valid, unexpired session cookie, or null.
 * @example const claims = await sessionTokenClaims(ctx.cookies); // { uid: 'a1b2…', sid, sv } or null
 */
export async function sessionTokenClaims(cookies: AstroCookies): Promise<SessionTokenClaims | null> {
  for (const name of COOKIE_NAMES) {
    const token = cookieValue(cookies, name);
    if (!token) continue;
    const known = decoded.get(token);
    if (known && known.expiresAt > Date.now()) return known.claims;
    decoded.delete(token);
    try {
      const payload = await decode({ token, secret: config.authSecret, salt: name });
      const claims = typeof payload?.uid === 'string' ? { uid: payload.uid, sid: payload.sid, sv: payload.sv } : null;
      remember(token, claims, payload?.exp);
      return claims;
    } catch {
      // Tampered, signed with another secret, or expired: treat as signed out.
      return null;
    }
  }
  return null;
}
