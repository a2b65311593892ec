// The headers every answer carries, and a Content-Security-Policy that still lets every inline
// script the pages really contain run: each one must be listed by its SHA-256 hash (CSP Level 3,
// W3C, §8.4 "hash-source"), with no 'unsafe-inline' or 'unsafe-eval' for scripts.
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { Client } from '../helpers/http';
import { newCustomer, newStaff } from '../helpers/people';
import { db } from '../helpers/db';
import { createCase, createUser } from '../../seeds/factories';

const scriptSrc = (csp: string) => csp.split(';').map((d) => d.trim()).find((d) => d.startsWith('script-src')) ?? '';
const inlineScripts = (html: string) => [...html.matchAll(/<script(?![^>]*\bsrc=)[^>]*>([\s\S]*?)<\/script>/g)].map((m) => m[1]!);
const hashOf = (text: string) => `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;

function expectSafeHeaders(res: Response) {
  expect(res.headers.get('x-content-type-options')).toBe('nosniff');
  expect(res.headers.get('referrer-policy')).toBe('strict-origin-when-cross-origin');
  expect(res.headers.get('permissions-policy')).toContain('camera=(self)');
  expect(res.headers.get('content-security-policy')).toContain("frame-ancestors 'none'");
  // The test stack serves plain http: no HSTS (it would be ignored, and wrong, there).
  expect(res.headers.get('strict-transport-security')).toBeNull();
}

describe('security headers', () => {
  it('sends them on pages, API answers, errors and redirects', async () => {
    const anon = new Client();
    for (const path of ['/', '/signin', '/api/health', '/api/me', '/api/no-such-thing', '/office', '/no-such-page']) {
      expectSafeHeaders(await anon.fetch(path));
    }
  });

  it('lets every inline script on the pages run by hash, and never allows eval', async () => {
    const { client: customer, case: c } = await newCustomer();
    const { client: admin } = await newStaff('admin');
    const { client: surveyor, user: s } = await newStaff('surveyor');
    const booked = await createCase(db, { customerId: (await createUser(db, { role: 'customer' })).id, stage: 'survey_booked', surveyorId: s.id, surveyDate: '2099-02-01' });
    const pages: [Client, string][] = [
      [new Client(), '/signin'],
      [customer, '/my'],
      [customer, `/my/cases/${c!.id}`],
      [customer, `/my/cases/${c!.id}/plan`],
      [customer, `/my/cases/${c!.id}/photos`],
      [admin, '/office'],
      [admin, `/office/cases/${c!.id}`],
      [admin, '/office/settings'],
      [surveyor, `/surveys/cases/${booked.id}`],
    ];
    let seen = 0;
    for (const [client, path] of pages) {
      const res = await client.fetch(path);
      expect(res.status, path).toBe(200);
      const csp = res.headers.get('content-security-policy') ?? '';
      const src = scriptSrc(csp);
      expect(src, path).toMatch(/^script-src 'self'/);
      expect(src).not.toContain('unsafe-eval');
      expect(src).not.toContain('unsafe-inline');
      for (const script of inlineScripts(await res.text())) {
        seen++;
        expect(src, `${path}: ${script.slice(0, 60)}`).toContain(hashOf(script));
      }
    }
    // The pages do have inline scripts (Astro's island loader at least), so the hashes were tested.
    expect(seen).toBeGreaterThan(pages.length);
  });

  it('keeps signed-in pages and every API answer out of caches', async () => {
    const { client } = await newCustomer();
    expect((await client.fetch('/my')).headers.get('cache-control')).toBe('no-store');
    expect((await client.fetch('/api/me')).headers.get('cache-control')).toContain('no-store');
    expect((await new Client().fetch('/api/me')).headers.get('cache-control')).toContain('no-store');
  });
});
