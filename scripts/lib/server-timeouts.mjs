// Loaded with `node --import` before the built app (see appCommand in stack.mjs). The Astro Node
// adapter's standalone server calls http.createServer(listener) with Node's defaults, and Node 20
// cuts any request still arriving after requestTimeout (300 s). A 15 MB photo sent from a phone
// on a poor link (1 Mbit/s ≈ 2 minutes, 256 kbit/s ≈ 8 minutes) must not be cut off, so the
// server gets a longer whole-request limit; headers must still arrive within headersTimeout
// (60 s), which keeps slow-header connections from piling up. Keep this the only change here.
import http from 'node:http';

const seconds = (name, fallback) => {
  const n = Number(process.env[name]);
  return Number.isFinite(n) && n > 0 ? n : fallback;
};

const requestTimeout = seconds('SERVER_REQUEST_TIMEOUT_SECONDS', 20 * 60) * 1000;

export const serverTimeouts = {
  requestTimeout,
  // Node refuses a headers limit longer than the whole-request one.
  headersTimeout: Math.min(requestTimeout, seconds('SERVER_HEADERS_TIMEOUT_SECONDS', 60) * 1000),
  // How often Node checks those limits (its default is 30 s, too coarse for short test limits).
  connectionsCheckingInterval: seconds('SERVER_TIMEOUT_CHECK_SECONDS', 30) * 1000,
};

const original = http.createServer;
http.createServer = function createServer(...args) {
  const [first, ...rest] = args;
  return typeof first === 'function' || first === undefined
    ? original.call(this, { ...serverTimeouts }, first, ...rest)
    : original.call(this, { ...serverTimeouts, ...first }, ...rest);
};
