// Request bodies are capped at 1 MB before anything buffers them: a declared length over the cap
// is answered 413 while the client has sent almost none of it; a body of unknown length is read
// through the cap and cut off there.
import { request as httpRequest } from 'node:http';
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { baseUrl } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { newCustomer } from '../helpers/people';

const MB = 1024 * 1024;

/**
 * Sends headers and then the body slowly, chunk by chunk, and stops as soon as an answer comes.
 * Resolves with the status, the answer's body and how many body bytes had gone out by then.
 */
function slowPost(path: string, headers: Record<string, string>, totalBytes: number, cookie = '', method = 'POST'): Promise<{ status: number; body: string; sent: number }> {
  return new Promise((resolve, reject) => {
    const url = new URL(path, baseUrl);
    let sent = 0;
    let answered = false;
    const req = httpRequest(url, { method, headers: { origin: baseUrl, ...(cookie ? { cookie } : {}), ...headers } }, (res) => {
      answered = true;
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (c) => (body += c));
      res.on('end', () => {
        req.destroy();
        resolve({ status: res.statusCode ?? 0, body, sent });
      });
    });
    req.on('error', (err) => (answered ? undefined : reject(err)));
    const chunk = Buffer.alloc(64 * 1024, 0x61);
    const pump = () => {
      if (answered || sent >= totalBytes) return void (answered || req.end());
      sent += chunk.length;
      req.write(chunk, () => setTimeout(pump, 5));
    };
    req.flushHeaders();
    setTimeout(pump, 50);
  });
}

describe('request body cap', () => {
  it('refuses an anonymous 100 MB sign-in POST with 413 before reading it', async () => {
    const r = await slowPost('/api/auth/callback/credentials', { 'content-type': 'application/x-www-form-urlencoded', 'content-length': String(100 * MB) }, 100 * MB);
    expect(r.status).toBe(413);
    expect(JSON.parse(r.body).error.code).toBe('payload_too_large');
    // Answered on the headers: at most a few chunks had left the client.
    expect(r.sent).toBeLessThan(2 * MB);
  });

  it('refuses a 2 MB checklist save with 413 and changes nothing', async () => {
    const { client, case: c } = await newCustomer();
    // Sent over a raw socket: the server answers 413 and closes on the declared length, and
    // fetch would report the closed connection (EPIPE) instead of the answer when it loses the race.
    const r = await slowPost(`/api/cases/${c!.id}/checklist`, { 'content-type': 'application/json', 'content-length': String(2 * MB) }, 2 * MB, client.cookieHeader(), 'PATCH');
    expect(r.status).toBe(413);
    expect(JSON.parse(r.body).error.code).toBe('payload_too_large');
    const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, c!.id));
    expect(row!.version).toBe(c!.version);
  });

  it('cuts off a JSON body of unknown length (chunked) at the cap', async () => {
    const { client, case: c } = await newCustomer();
    const r = await slowPost(`/api/cases/${c!.id}/checklist`, { 'content-type': 'application/json', 'transfer-encoding': 'chunked' }, 8 * MB, client.cookieHeader(), 'PATCH');
    expect(r.status).toBe(413);
    expect(r.sent).toBeLessThan(3 * MB);
  });

  it('asks for a length on a form body of unknown length (411), since Auth.js would read it whole', async () => {
    const r = await slowPost('/api/auth/signin/nodemailer', { 'content-type': 'application/x-www-form-urlencoded', 'transfer-encoding': 'chunked' }, 4 * MB);
    expect(r.status).toBe(411);
    expect(JSON.parse(r.body).error.code).toBe('length_required');
  });

  it('still takes an ordinary save', async () => {
    const { client, case: c } = await newCustomer();
    const r = await client.send('PATCH', `/api/cases/${c!.id}/checklist`, { about: { fullName: 'Ann Example' } });
    expect(r.status).toBe(200);
  });
});
