// Every request passes through here: sign-in attempts are rate-limited, then the session is
// read and `locals.user` filled with the active user (or null).
import { defineMiddleware, sequence } from 'astro:middleware';
import { errorResponse, HttpError } from './lib/server/http';
import { signInLimits } from './lib/server/rate-limit.server';
import { sessionUserId } from './lib/server/session.server';
import { findActiveUser, normaliseEmail } from './lib/server/users.server';

const PASSWORD_PATH = '/api/auth/callback/credentials';
const LINK_PATH = '/api/auth/signin/nodemailer';

async function emailOf(request: Request): Promise<string> {
  try {
    const form = await request.clone().formData();
    return normaliseEmail(String(form.get('email') ?? ''));
  } catch {
    return '';
  }
}

function tooMany(seconds: number): Response {
  const res = errorResponse(
    new HttpError(429, 'rate_limited', `Too many sign-in attempts. Please wait ${Math.ceil(seconds / 60)} minutes and try again.`),
  );
  res.headers.set('Retry-After', String(seconds));
  return res;
}

/** A sign-in answer that carries `error=` in its redirect is a failed attempt. */
async function failed(res: Response): Promise<boolean> {
  const location = res.headers.get('location') ?? '';
  if (location.includes('error=')) return true;
  if ((res.headers.get('content-type') ?? '').includes('json')) {
    const body = (await res.clone().json().catch(() => ({}))) as { url?: string };
    return typeof body.url === 'string' && body.url.includes('error=');
  }
  return false;
}

const rateLimit = defineMiddleware(async (ctx, next) => {
  const { pathname } = ctx.url;
  if (ctx.request.method !== 'POST' || (pathname !== PASSWORD_PATH && pathname !== LINK_PATH)) return next();
  const email = await emailOf(ctx.request);
  const address = ctx.clientAddress ?? 'unknown';
  const [perEmail, perAddress] =
    pathname === PASSWORD_PATH
      ? [signInLimits.passwordPerEmail, signInLimits.passwordPerAddress]
      : [signInLimits.linkPerEmail, signInLimits.linkPerAddress];
  const emailKey = `e:${email}`;
  const addressKey = `a:${address}`;
  if (!perEmail.allows(emailKey)) return tooMany(perEmail.retryAfterSeconds(emailKey));
  if (!perAddress.allows(addressKey)) return tooMany(perAddress.retryAfterSeconds(addressKey));
  const res = await next();
  // Passwords count only failures (staff sign in often); links count every request (each sends mail).
  if (pathname === LINK_PATH || (await failed(res))) {
    perEmail.hit(emailKey);
    perAddress.hit(addressKey);
  }
  return res;
});

const auth = defineMiddleware(async (ctx, next) => {
  ctx.locals.user = null;
  if (ctx.url.pathname.startsWith('/api/auth/') || ctx.url.pathname.startsWith('/_astro/')) return next();
  // The cookie says who; the database says whether they are still active, on every request, so
  // a deactivated account stops at once.
  const id = await sessionUserId(ctx.cookies);
  if (id) ctx.locals.user = (await findActiveUser(id)) ?? null;
  return next();
});

export const onRequest = sequence(rateLimit, auth);
