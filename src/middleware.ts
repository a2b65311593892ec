// Every request passes through here, in order:
// 1. request state: the client's address (TRUST_PROXY decides whether X-Forwarded-For counts)
//    for the limits that Auth.js's credentials check and link sender apply themselves; a request
//    they refused is answered 429 here, whichever URL reached them;
// 2. paths with doubled slashes are refused; a declared body over 1 MB is refused before anything reads it;
// 3. session: `locals.user` is the active user whose session has not been ended, or null;
// 4. security headers on every answer; pages name the scripts they will import (module preloads).
import { countOf } from './lib/grammar';
import { defineMiddleware, sequence } from 'astro:middleware';
import { bodyRefusal } from './lib/server/body-limit.server';
import { isDatabaseUnavailable } from './lib/server/db-errors.server';
import { databaseUnavailable, errorResponse, HttpError, UNAVAILABLE_HEADER } from './lib/server/http';
import { clientAddressOf, runWithRequestState, type RequestState } from './lib/server/request-context.server';
import { withPagePreloads } from './lib/server/module-preloads.server';
import { withSecurityHeaders } from './lib/server/security-headers.server';
import { sessionTokenClaims } from './lib/server/session.server';
import { findSessionUser } from './lib/server/sessions.server';

function tooMany(seconds: number): Response {
  const res = errorResponse(
    new HttpError(429, 'rate_limited', `Too many sign-in attempts. Please wait ${countOf(Math.ceil(seconds / 60), 'minute')} and try again.`),
  );
  res.headers.set('Retry-After', String(seconds));
  return res;
}

const requestState = defineMiddleware((ctx, next) => {
  // A server in front of Astro may hand over the socket's own address as locals.peerAddress.
  const peer = (ctx.locals as { peerAddress?: string }).peerAddress;
  let astroAddress: string | undefined;
  try {
    astroAddress = ctx.clientAddress;
  } catch {
    astroAddress = undefined;
  }
  const state: RequestState = { clientAddress: clientAddressOf(ctx.request.headers, astroAddress, peer) };
  return runWithRequestState(state, async () => {
    const res = await next();
    return state.refusal ? tooMany(state.refusal.retryAfterSeconds) : res;
  });
});

const bodyCap = defineMiddleware((ctx, next) => {
  // "//" in a path is never one of our routes; Auth.js would throw on it (a 500) rather than refuse.
  if (ctx.url.pathname.includes('//')) return errorResponse(new HttpError(404, 'not_found', 'That address was not found.'));
  const refusal = bodyRefusal(ctx.request, ctx.routePattern);
  if (!refusal) return next();
  // Nothing of the body is read; the connection closes after the answer.
  const res = errorResponse(refusal);
  res.headers.set('Connection', 'close');
  return res;
});

const failedRequests = new WeakSet<Request>();

const auth = defineMiddleware(async (ctx, next) => {
  ctx.locals.user = null;
  // Astro renders src/pages/500.astro for the same request through this middleware again: asking
  // the database a second time would fail again and lose the error the page explains.
  if (failedRequests.has(ctx.request)) return next();
  if (ctx.url.pathname.startsWith('/_astro/')) return next();
  // Auth.js answers its session route from the cookie alone, so that one of its routes is checked
  // here like any page: a cookie whose session was ended (signed out, signed out everywhere,
  // deactivated) must not be described as signed in there. Its other routes need no user.
  const sessionRoute = /^\/api\/auth\/session\/?$/.test(ctx.url.pathname);
  if (ctx.url.pathname.startsWith('/api/auth/') && !sessionRoute) return next();
  // The cookie says who; the database says whether the account is active and the session has
  // not been ended, on every request, so a sign-out or deactivation takes effect at once.
  const claims = await sessionTokenClaims(ctx.cookies);
  if (claims) {
    try {
      ctx.locals.user = (await findSessionUser(claims)) ?? null;
    } catch (err) {
      // API callers get the JSON 503; pages fall through to src/pages/500.astro, which says 503 kindly.
      if (!isDatabaseUnavailable(err)) throw err;
      if (ctx.url.pathname.startsWith('/api/')) return errorResponse(databaseUnavailable());
      failedRequests.add(ctx.request);
      throw err;
    }
  }
  if (sessionRoute && claims && !ctx.locals.user) {
    return new Response('null', { status: 200, headers: { 'Content-Type': 'application/json', 'Cache-Control': 'no-store' } });
  }
  return next();
});

// Astro always answers its 500 page with status 500; when that page says the database is
// unreachable, this turns it into the 503 (with Retry-After) that it really is.
const unavailableStatus = defineMiddleware(async (_ctx, next) => {
  const res = await next();
  if (res.status !== 500 || !res.headers.has(UNAVAILABLE_HEADER)) return res;
  const headers = new Headers(res.headers);
  headers.delete(UNAVAILABLE_HEADER);
  return new Response(res.body, { status: 503, statusText: 'Service Unavailable', headers });
});

const headers = defineMiddleware(async (ctx, next) => {
  const res = await next();
  return withSecurityHeaders(res, { signedIn: ctx.locals.user != null || ctx.url.pathname.startsWith('/api/') });
});

// Pages list every script their islands import, so a phone asks for all of them at once.
const preloads = defineMiddleware(async (_ctx, next) => withPagePreloads(await next()));

export const onRequest = sequence(headers, preloads, unavailableStatus, requestState, bodyCap, auth);
