// Where a sign-in may send someone afterwards: a path on this app, never another site.
// Shared by the server (Auth.js's redirect callback, the sign-in page) and the sign-in form.

/**
 * The same-origin path (with query and hash) a callback URL points at, or `fallback`.
 * Parsing with the URL parser, as the browser will, catches what string checks miss:
 * `/\evil.example`, `/%09/evil.example`, tabs and newlines, `https:evil.example`.
 * @example safeCallbackPath('/\\evil.example/x', 'http://127.0.0.1:4321') // '/home'
 * @example safeCallbackPath('http://127.0.0.1:4321/my?x=1', 'http://127.0.0.1:4321') // '/my?x=1'
 */
export function safeCallbackPath(value: string | null | undefined, appOrigin: string, fallback = '/home'): string {
  if (!value) return fallback;
  let origin: string;
  let target: URL;
  try {
    origin = new URL(appOrigin).origin;
    target = new URL(value, origin);
  } catch {
    return fallback;
  }
  if (target.origin !== origin) return fallback;
  const path = `${target.pathname}${target.search}${target.hash}`;
  // A path that a second parse would read as another host ("//x") is refused too.
  return path.startsWith('/') && !path.startsWith('//') && !path.startsWith('/\\') ? path : fallback;
}
