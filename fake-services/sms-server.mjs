// @ts-check
// Fake SMS service: a local stand-in for the SMS provider (Vonage's SMS API, see
// docs/decisions/008-sms-provider.md). It takes texts in the provider's REST shape
// (POST /sms/json), keeps them in memory for a person or a test to read at GET /api/sms, sends a
// signed delivery receipt to the callback the text named, and can play an inbound reply
// (POST /api/sms/reply) signed the way the provider signs its webhooks.
import http from 'node:http';
import { createHash, createHmac, randomBytes } from 'node:crypto';
import { pathToFileURL } from 'node:url';

const HOST = '127.0.0.1';
const MAX_TEXTS = 2000;
const MAX_BODY_BYTES = 64 * 1024;

/**
 * The provider's webhook signature, worked from its signing guide (from memory): parameters
 * sorted by name, joined as "&name=value" with any & or = in a value turned into _, then an HMAC
 * of that string with the signature secret (hex), or for "md5hash" an MD5 of the string followed
 * by the secret. Written here on its own, not taken from the SDK, so the app's check is tested
 * against an independent signer.
 *
 * @param {Record<string, string>} params without `sig`
 * @param {string} secret
 * @param {string} method md5hash | md5 | sha1 | sha256 | sha512
 */
export function signParams(params, secret, method) {
  const query = Object.keys(params)
    .filter((k) => k !== 'sig')
    .sort()
    .map((k) => `&${k}=${String(params[k]).replace(/[&=]/g, '_')}`)
    .join('');
  if (method === 'md5hash') return createHash('md5').update(query + secret).digest('hex');
  if (!['md5', 'sha1', 'sha256', 'sha512'].includes(method)) throw new Error(`Unknown signature method ${method}`);
  return createHmac(method, secret).update(query).digest('hex');
}

/** @param {Date} d  "YYYY-MM-DD HH:MM:SS" in UTC, as the provider writes message-timestamp. */
const providerTime = (d) => d.toISOString().slice(0, 19).replace('T', ' ');

/**
 * @typedef {object} StoredText
 * @property {string} id the provider's message id
 * @property {string} to
 * @property {string} from
 * @property {string} text
 * @property {string | null} clientRef
 * @property {string | null} callback
 * @property {string} status submitted | delivered | failed | …
 * @property {number | null} receiptAnswer the app's HTTP status for the last receipt
 * @property {string} date
 */

/**
 * @typedef {object} SmsServerOptions
 * @property {number} [port] 0 lets the OS choose; defaults to FAKE_SMS_PORT or 1090
 * @property {string} [apiKey] accepted API key (FAKE_SMS_API_KEY, default "fake-key")
 * @property {string} [apiSecret] accepted API secret (FAKE_SMS_API_SECRET, default "fake-secret")
 * @property {string} [signatureSecret] FAKE_SMS_SIGNATURE_SECRET, default "fake-signature-secret"
 * @property {string} [signatureMethod] FAKE_SMS_SIGNATURE_METHOD, default sha256
 * @property {string} [inboundUrl] where replies go (FAKE_SMS_INBOUND_URL)
 * @property {number} [receiptDelayMs] how long before the delivery receipt, default 100
 * @property {boolean} [quiet]
 */

/** @param {http.ServerResponse} res @param {number} status @param {unknown} body */
function sendJson(res, status, body) {
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
  res.end(JSON.stringify(body));
}

/** @param {http.IncomingMessage} req @returns {Promise<Record<string, unknown>>} */
async function readBody(req) {
  const chunks = [];
  let size = 0;
  for await (const chunk of req) {
    size += chunk.length;
    if (size > MAX_BODY_BYTES) throw new Error('Body too large');
    chunks.push(chunk);
  }
  const raw = Buffer.concat(chunks).toString('utf8');
  if (raw === '') return {};
  if ((req.headers['content-type'] ?? '').includes('application/x-www-form-urlencoded')) return Object.fromEntries(new URLSearchParams(raw));
  const parsed = JSON.parse(raw);
  return parsed && typeof parsed === 'object' && !Array.isArray(parsed) ? parsed : {};
}

/**
 * Starts the fake on 127.0.0.1.
 * @example const sms = await startSmsServer({ port: 0, quiet: true }); … await sms.close();
 * @param {SmsServerOptions} [options]
 */
export async function startSmsServer(options = {}) {
  const env = process.env;
  const apiKey = options.apiKey ?? env.FAKE_SMS_API_KEY ?? 'fake-key';
  const apiSecret = options.apiSecret ?? env.FAKE_SMS_API_SECRET ?? 'fake-secret';
  const signatureSecret = options.signatureSecret ?? env.FAKE_SMS_SIGNATURE_SECRET ?? 'fake-signature-secret';
  const signatureMethod = options.signatureMethod ?? env.FAKE_SMS_SIGNATURE_METHOD ?? 'sha256';
  const inboundUrl = options.inboundUrl ?? env.FAKE_SMS_INBOUND_URL ?? null;
  const receiptDelayMs = options.receiptDelayMs ?? 100;
  const log = options.quiet ? () => {} : (/** @type {string} */ line) => console.log(`[fake-sms] ${line}`);
  /** @type {StoredText[]} */
  let texts = [];
  const timers = new Set();

  /** @param {Record<string, string>} params */
  const signed = (params) => {
    const withStamp = { ...params, timestamp: String(Math.floor(Date.now() / 1000)), nonce: randomBytes(8).toString('hex') };
    return { ...withStamp, sig: signParams(withStamp, signatureSecret, signatureMethod) };
  };

  /** @param {string} url @param {Record<string, string>} params */
  async function post(url, params) {
    const res = await fetch(url, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(signed(params)) });
    await res.arrayBuffer();
    return res.status;
  }

  /** @param {StoredText} t @param {string} status @param {string} errCode */
  async function sendReceipt(t, status, errCode) {
    t.status = status;
    if (!t.callback) return null;
    const now = new Date();
    const params = {
      msisdn: t.to,
      to: t.from,
      'network-code': '23410',
      messageId: t.id,
      price: '0.03330000',
      status,
      scts: now.toISOString().slice(2, 16).replace(/[-T:]/g, ''),
      'err-code': errCode,
      'api-key': apiKey,
      'message-timestamp': providerTime(now),
      ...(t.clientRef ? { 'client-ref': t.clientRef } : {}),
    };
    try {
      t.receiptAnswer = await post(t.callback, params);
    } catch (err) {
      log(`receipt to ${t.callback} failed: ${err instanceof Error ? err.message : err}`);
      t.receiptAnswer = null;
    }
    return t.receiptAnswer;
  }

  /** @param {http.IncomingMessage} req @param {http.ServerResponse} res */
  async function sendText(req, res) {
    const body = await readBody(req);
    const auth = (req.headers.authorization ?? '').replace(/^Basic /, '');
    const [key, secret] = Buffer.from(auth, 'base64').toString('utf8').split(':');
    const creds = key === apiKey && secret === apiSecret || (body['api_key'] === apiKey && body['api_secret'] === apiSecret);
    // The provider answers 200 with a per-message status: 4 is bad credentials, 2 a missing parameter.
    if (!creds) return sendJson(res, 200, { 'message-count': '1', messages: [{ status: '4', 'error-text': 'Bad Credentials' }] });
    const to = String(body.to ?? '');
    const from = String(body.from ?? '');
    const text = typeof body.text === 'string' ? body.text : '';
    if (!to || !from || !text) return sendJson(res, 200, { 'message-count': '1', messages: [{ status: '2', 'error-text': 'Missing to, from or text' }] });
    if (!/^\d{7,15}$/.test(to)) return sendJson(res, 200, { 'message-count': '1', messages: [{ status: '3', 'error-text': 'Invalid to' }] });
    const id = randomBytes(8).toString('hex').toUpperCase();
    /** @type {StoredText} */
    const stored = {
      id, to, from, text,
      clientRef: typeof body['client-ref'] === 'string' ? body['client-ref'] : null,
      callback: typeof body.callback === 'string' ? body.callback : null,
      status: 'submitted', receiptAnswer: null, date: new Date().toISOString(),
    };
    texts.push(stored);
    if (texts.length > MAX_TEXTS) texts = texts.slice(-MAX_TEXTS);
    log(`text ${id} to ${to}: ${text.slice(0, 60)}`);
    const timer = setTimeout(() => {
      timers.delete(timer);
      void sendReceipt(stored, 'delivered', '0');
    }, receiptDelayMs);
    timers.add(timer);
    return sendJson(res, 200, {
      'message-count': '1',
      messages: [{ to, 'message-id': id, status: '0', 'remaining-balance': '10.00000000', 'message-price': '0.03330000', network: '23410', ...(stored.clientRef ? { 'client-ref': stored.clientRef } : {}) }],
    });
  }

  /** @param {http.IncomingMessage} req @param {http.ServerResponse} res */
  async function reply(req, res) {
    const body = await readBody(req);
    const from = String(body.from ?? '').replace(/^\+/, '');
    const text = typeof body.text === 'string' ? body.text : '';
    const url = typeof body.url === 'string' ? body.url : inboundUrl;
    if (!/^\d{7,15}$/.test(from) || !text) return sendJson(res, 422, { error: { code: 'invalid', message: 'Send { from: "447…", text: "STOP" }.' } });
    if (!url) return sendJson(res, 409, { error: { code: 'conflict', message: 'No inbound URL: set FAKE_SMS_INBOUND_URL or send url.' } });
    const to = typeof body.to === 'string' ? body.to.replace(/^\+/, '') : texts.findLast((t) => t.to === from)?.from ?? '447700900000';
    const messageId = randomBytes(8).toString('hex').toUpperCase();
    const now = new Date();
    const first = text.trim().split(/\s+/)[0] ?? '';
    const status = await post(url, {
      msisdn: from, to, messageId, text, type: 'text', keyword: first.toUpperCase(), 'api-key': apiKey, 'message-timestamp': providerTime(now),
    });
    log(`reply from ${from}: ${text} → ${status}`);
    return sendJson(res, 200, { messageId, delivered: status });
  }

  /** @param {http.IncomingMessage} req @param {http.ServerResponse} res */
  async function handle(req, res) {
    const url = new URL(req.url ?? '/', `http://${HOST}`);
    const path = url.pathname;
    if (req.method === 'POST' && path === '/sms/json') return sendText(req, res);
    if (req.method === 'GET' && path === '/api/sms') {
      const to = url.searchParams.get('to')?.replace(/^\+/, '');
      return sendJson(res, 200, to ? texts.filter((t) => t.to === to) : texts);
    }
    if (req.method === 'DELETE' && path === '/api/sms') {
      texts = [];
      res.writeHead(204).end();
      return;
    }
    if (req.method === 'POST' && path === '/api/sms/reply') return reply(req, res);
    // Plays another receipt for a text, e.g. { status: "failed", errCode: "6" }.
    const receipt = /^\/api\/sms\/([^/]+)\/receipt$/.exec(path);
    if (req.method === 'POST' && receipt) {
      const t = texts.find((x) => x.id === receipt[1]);
      if (!t) return sendJson(res, 404, { error: { code: 'not_found', message: 'No text with that id.' } });
      const body = await readBody(req);
      const answer = await sendReceipt(t, String(body.status ?? 'delivered'), String(body.errCode ?? '0'));
      return sendJson(res, 200, { delivered: answer });
    }
    return sendJson(res, 404, { error: { code: 'not_found', message: 'Nothing here. Try POST /sms/json or GET /api/sms.' } });
  }

  const server = http.createServer((req, res) => {
    handle(req, res).catch((err) => sendJson(res, 400, { error: { code: 'bad_request', message: err instanceof Error ? err.message : 'Bad request' } }));
  });
  const wanted = options.port ?? Number(env.FAKE_SMS_PORT ?? 1090);
  const port = await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(wanted, HOST, () => {
      const address = server.address();
      resolve(typeof address === 'object' && address ? address.port : wanted);
    });
  });
  const close = () =>
    new Promise((resolve) => {
      for (const t of timers) clearTimeout(t);
      server.close(() => resolve(undefined));
      server.closeAllConnections();
    });
  return { port: /** @type {number} */ (port), close };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  const running = await startSmsServer();
  console.log(`[fake-sms] SMS API on http://${HOST}:${running.port}/sms/json · sent texts at http://${HOST}:${running.port}/api/sms`);
  const stop = () => running.close().then(() => process.exit(0));
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}
