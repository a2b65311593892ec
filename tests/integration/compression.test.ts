// Responses are compressed as the client's Accept-Encoding allows (RFC 9110 §12.5.3 and §8.4),
// and sent as they are when it allows nothing. Bodies are checked by decoding them with Node's
// own zlib, the reference implementation of gzip (RFC 1952) and brotli (RFC 7932) here.
import { beforeAll, describe, expect, it } from 'vitest';
import http from 'node:http';
import { brotliDecompressSync, gunzipSync } from 'node:zlib';
import { baseUrl, type Client } from '../helpers/http';
import { newStaff } from '../helpers/people';

type Raw = { status: number; headers: http.IncomingHttpHeaders; body: Buffer };

/** A request through node:http, which (unlike fetch) neither asks for nor undoes compression. */
function raw(path: string, headers: Record<string, string>): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = http.get(new URL(path, baseUrl), { headers }, (res) => {
      const parts: Buffer[] = [];
      res.on('data', (chunk: Buffer) => parts.push(chunk));
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(parts) }));
    });
    req.on('error', reject);
  });
}

function decoded(r: Raw): string {
  const enc = r.headers['content-encoding'];
  if (enc === 'br') return brotliDecompressSync(r.body).toString('utf8');
  if (enc === 'gzip') return gunzipSync(r.body).toString('utf8');
  return r.body.toString('utf8');
}

let admin: Client;
let scriptPath: string;

beforeAll(async () => {
  admin = (await newStaff('admin')).client;
  // The office queue page loads the biggest island: take its largest script as the JS sample
  // (files under 1 KB are sent as they are, since compressing them saves less than it costs).
  const page = await raw('/office', { cookie: admin.cookieHeader() });
  const paths = [...page.body.toString('utf8').matchAll(/(?:src|component-url|href)="(\/_astro\/[^"]+\.js)"/g)].map((m) => m[1]!);
  if (paths.length === 0) throw new Error('no /_astro/ script on /office');
  const sizes = await Promise.all([...new Set(paths)].map(async (path) => ({ path, size: (await raw(path, { 'accept-encoding': 'identity' })).body.length })));
  scriptPath = sizes.sort((a, b) => b.size - a.size)[0]!.path;
});

describe('compressed responses', () => {
  const cases: [string, () => { path: string; cookie?: string }, RegExp][] = [
    ['an HTML page', () => ({ path: '/signin' }), /text\/html/],
    ['a JSON answer', () => ({ path: '/api/cases?pageSize=50', cookie: admin.cookieHeader() }), /application\/json/],
    ['a built script', () => ({ path: scriptPath }), /javascript/],
  ];

  for (const [what, target, type] of cases) {
    it(`${what}: brotli when asked for, gzip when only that is, none when neither is`, async () => {
      const { path, cookie } = target();
      const base: Record<string, string> = cookie ? { cookie } : {};
      const plain = await raw(path, { ...base, 'accept-encoding': 'identity' });
      expect(plain.status).toBe(200);
      expect(plain.headers['content-type']).toMatch(type);
      expect(plain.headers['content-encoding']).toBeUndefined();

      const br = await raw(path, { ...base, 'accept-encoding': 'gzip, deflate, br' });
      expect(br.headers['content-encoding']).toBe('br');
      expect(br.headers.vary).toMatch(/accept-encoding/i);
      const gz = await raw(path, { ...base, 'accept-encoding': 'gzip' });
      expect(gz.headers['content-encoding']).toBe('gzip');

      // Same content either way (a page carries a fresh CSRF token etc., so compare the shape).
      const text = decoded(plain);
      for (const r of [br, gz]) {
        expect(r.body.length).toBeLessThan(plain.body.length);
        const other = decoded(r);
        if (type.source.includes('javascript')) expect(other).toBe(text);
        else expect(other.length).toBeGreaterThan(text.length * 0.9);
      }
      const none = await raw(path, base);
      expect(none.headers['content-encoding']).toBeUndefined();
    });
  }

  it('hashed scripts are cached for a year as immutable, whichever copy is sent', async () => {
    for (const enc of ['br', 'gzip', 'identity']) {
      const r = await raw(scriptPath, { 'accept-encoding': enc });
      expect(r.headers['cache-control']).toBe('public, max-age=31536000, immutable');
      // Served before the app's middleware, so the static server sets the sniffing guard itself.
      expect(r.headers['x-content-type-options']).toBe('nosniff');
    }
  });

  it('pages and API answers keep the headers the app set', async () => {
    const r = await raw('/api/health', { 'accept-encoding': 'br' });
    expect(r.headers['cache-control']).toBe('no-store');
    expect(JSON.parse(decoded(r))).toEqual({ ok: true, db: 'up' });
  });
});
