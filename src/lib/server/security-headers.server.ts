// Server-only: the headers every response carries. The Content-Security-Policy allows scripts
// from our own origin plus, by SHA-256 hash, exactly the small inline scripts Astro writes to
// hydrate islands (its island element and the client:* directive loaders), and the checklist's
// early-answer recorder. No 'unsafe-eval',
// no 'unsafe-inline' for scripts. Styles allow inline: React and Uppy set style attributes.
import { createHash } from 'node:crypto';
import islandScript from 'astro/runtime/server/astro-island.prebuilt.js';
import islandScriptDev from 'astro/runtime/server/astro-island.prebuilt-dev.js';
import idleScript from 'astro/runtime/client/idle.prebuilt.js';
import loadScript from 'astro/runtime/client/load.prebuilt.js';
import mediaScript from 'astro/runtime/client/media.prebuilt.js';
import onlyScript from 'astro/runtime/client/only.prebuilt.js';
import visibleScript from 'astro/runtime/client/visible.prebuilt.js';
import { config } from './config.server';
import { EARLY_ANSWER_RECORDER } from '@/lib/early-answers';

const sha256 = (text: string) => `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;

/**
 * Hashes of the inline scripts Astro itself writes into pages (the same text in every build of
 * this Astro version), and of our one own: the checklist's early-answer recorder.
 */
export const inlineScriptHashes = [islandScript, islandScriptDev, idleScript, loadScript, mediaScript, onlyScript, visibleScript, EARLY_ANSWER_RECORDER].map(sha256);

export function contentSecurityPolicy(): string {
  return [
    "default-src 'self'",
    // `astro dev` writes page scripts inline as it serves them (a built app never does); a
    // browser ignores 'unsafe-inline' beside hashes, so dev gets it instead of them.
    `script-src 'self' ${import.meta.env?.DEV ? "'unsafe-inline'" : inlineScriptHashes.join(' ')}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "media-src 'self' blob:",
    "worker-src 'self' blob:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

const CSP = contentSecurityPolicy();

/**
 * Adds the security headers to a response (in place when its headers can change, else a copy).
 * `signedIn` pages and API answers are never stored by a browser or a proxy.
 */
export function withSecurityHeaders(response: Response, { signedIn }: { signedIn: boolean }): Response {
  let res = response;
  try {
    res.headers.set('X-Content-Type-Options', 'nosniff');
  } catch {
    // Immutable headers (a fetched or redirect Response): copy it once.
    res = new Response(response.body, response);
    res.headers.set('X-Content-Type-Options', 'nosniff');
  }
  const h = res.headers;
  const type = h.get('content-type') ?? '';
  if (type.includes('text/html')) h.set('Content-Security-Policy', CSP);
  else if (!h.has('Content-Security-Policy')) h.set('Content-Security-Policy', "default-src 'none'; frame-ancestors 'none'; sandbox");
  h.set('X-Frame-Options', 'DENY');
  h.set('Referrer-Policy', 'strict-origin-when-cross-origin');
  // Camera for photo uploads from a phone, on our own pages only; nothing else.
  h.set('Permissions-Policy', 'camera=(self), microphone=(), geolocation=(), payment=(), usb=()');
  h.set('Cross-Origin-Opener-Policy', 'same-origin');
  if (config.appUrl.startsWith('https://')) h.set('Strict-Transport-Security', 'max-age=31536000; includeSubDomains');
  if (signedIn && !h.has('Cache-Control')) h.set('Cache-Control', 'no-store');
  if (signedIn && type.includes('text/html')) h.set('Cache-Control', 'no-store');
  return res;
}
