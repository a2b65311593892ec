#!/usr/bin/env node
// The one way Groundwork's built app is served: `npm start`, `npm test`, the benchmarks and any
// cluster node run `node scripts/server.mjs`. Every HTTP server option lives here.
//
//   APP_DIST            build folder made by `astro build` (default: dist)
//   HOST, PORT          where to listen (default: 127.0.0.1:4321)
//   SERVER_REQUEST_TIMEOUT_SECONDS, SERVER_HEADERS_TIMEOUT_SECONDS: the whole-request and
//                       headers limits, from scripts/lib/server-timeouts.mjs (slow phone uploads
//                       need minutes: 20 minutes and 60 s by default)
//   KEEP_ALIVE_TIMEOUT_MS idle keep-alive connections close after this; behind a proxy set it
//                       above the proxy's own idle timeout (default: 5000)
//
// Layers, outermost first:
//   1. sirv serves the browser files from APP_DIST/client, choosing the .br or .gz copy made at
//      build time (scripts/lib/precompress.mjs) when the client accepts it.
//      Hashed files under /_astro/ are cached for a year as immutable.
//   2. compression (Express's middleware) compresses what the app renders — HTML, JSON, CSV —
//      with brotli or gzip as the client's Accept-Encoding allows. It only changes the body and
//      Content-Encoding/Content-Length/Vary: headers the app sets (security headers, cookies)
//      pass through untouched. Images and PDFs are not compressible and go out as they are.
//   3. Astro's Node adapter in middleware mode renders pages and API routes.
import http from 'node:http';
import { serverTimeouts } from './lib/server-timeouts.mjs';
import { resolve, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import compression from 'compression';
import sirv from 'sirv';

const root = resolve(new URL('..', import.meta.url).pathname);
const dist = resolve(root, process.env.APP_DIST ?? 'dist');
const host = process.env.HOST ?? '127.0.0.1';
const port = Number(process.env.PORT ?? 4321);
const ms = (name, fallback) => {
  const value = Number(process.env[name] ?? fallback);
  if (!Number.isFinite(value) || value < 0) throw new Error(`${name} must be a number of milliseconds, got "${process.env[name]}".`);
  return value;
};

const { handler: app } = await import(pathToFileURL(join(dist, 'server', 'entry.mjs')).href).catch((err) => {
  throw new Error(`No built app in ${dist} (run \`npm run build\` or set APP_DIST): ${err.message}`);
});

const IMMUTABLE = 'public, max-age=31536000, immutable';
const assets = sirv(join(dist, 'client'), {
  brotli: true,
  gzip: true,
  etag: true,
  setHeaders(res, pathname) {
    // Only files whose names carry a content hash may be cached for good; the rest revalidate.
    res.setHeader('Cache-Control', pathname.startsWith('/_astro/') ? IMMUTABLE : 'public, max-age=0, must-revalidate');
    // These files never pass through the app's middleware: keep browsers from guessing their type.
    res.setHeader('X-Content-Type-Options', 'nosniff');
  },
});
// threshold: below about 1 KB compression saves less than its own header overhead.
const compress = compression({ threshold: 1024 });

/**
 * compression's res.write drops a write's callback. Astro's adapter, when a page throws half-way
 * through streaming, writes "Internal server error" and destroys the response in that callback:
 * without it the connection would hang open. Call it once the chunk is handed on.
 */
function keepWriteCallbacks(res) {
  const write = res.write;
  res.write = function writeWithCallback(chunk, encoding, callback) {
    const done = typeof encoding === 'function' ? encoding : callback;
    const ok = write.call(this, chunk, typeof encoding === 'function' ? undefined : encoding);
    if (typeof done === 'function') process.nextTick(done);
    return ok;
  };
}

const server = http.createServer({ ...serverTimeouts }, (req, res) => {
  try {
    decodeURI(req.url ?? '/');
  } catch {
    res.writeHead(400).end('Bad request.');
    return;
  }
  const method = req.method ?? 'GET';
  const render = () =>
    compress(req, res, () => {
      keepWriteCallbacks(res);
      // The socket's own address, for TRUST_PROXY to check who sent X-Forwarded-For (request-context.server.ts).
      app(req, res, undefined, { peerAddress: req.socket.remoteAddress });
    });
  if (method === 'GET' || method === 'HEAD') assets(req, res, render);
  else render();
});
server.keepAliveTimeout = ms('KEEP_ALIVE_TIMEOUT_MS', 5_000);

server.listen(port, host, () => {
  if (process.env.GROUNDWORK_QUIET !== '1') console.log(`[groundwork] app listening on http://${host}:${port}`);
});

// Stop taking new connections, let requests in flight finish, then leave.
function stop() {
  server.close(() => process.exit(0));
  server.closeIdleConnections();
  setTimeout(() => process.exit(0), 10_000).unref();
}
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
