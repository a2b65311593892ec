// Server-only guards, called first in every page and endpoint. Permission is decided here,
// on the server, never in the browser.
import type { APIContext, AstroGlobal } from 'astro';
import type { Role } from '@/db/schema';
import { HttpError } from './http';
import type { SessionUser } from './users.server';

type Ctx = Pick<APIContext, 'locals'> | Pick<AstroGlobal, 'locals'>;

export const staffRoles: Role[] = ['admin', 'surveyor'];
export const isStaff = (u: SessionUser) => staffRoles.includes(u.role);

/** The signed-in user, or a 401 JSON error. */
export function requireUser(ctx: Ctx): SessionUser {
  const user = ctx.locals.user;
  if (!user) throw new HttpError(401, 'unauthenticated', 'Please sign in first.');
  return user;
}

/**
 * The signed-in user when they hold one of the roles, else 403 (401 when anonymous).
 * @example const admin = requireRole(ctx, 'admin');
 */
export function requireRole(ctx: Ctx, ...roles: Role[]): SessionUser {
  const user = requireUser(ctx);
  if (!roles.includes(user.role)) throw new HttpError(403, 'forbidden', 'Your account cannot do that.');
  return user;
}

/** Where each role lands after signing in. */
export function homeFor(role: Role): string {
  return role === 'customer' ? '/my' : role === 'admin' ? '/office' : '/surveys';
}

/**
 * For pages: a redirect Response when the visitor may not see the page, else the user.
 * Anonymous visitors go to sign-in; signed-in users with the wrong role go to their own home.
 */
export function pageGuard(Astro: AstroGlobal, ...roles: Role[]): SessionUser | Response {
  const user = Astro.locals.user;
  if (!user) {
    const back = Astro.url.pathname + Astro.url.search;
    return Astro.redirect(`/signin?callbackUrl=${encodeURIComponent(back)}`);
  }
  if (!roles.includes(user.role)) return Astro.redirect(homeFor(user.role));
  return user;
}
