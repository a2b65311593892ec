// Upload limits and file safety: a per-case quota, a per-user rate (counted in PostgreSQL), PDFs
// only ever downloaded, a customer cannot remove the firm's files, and stored files are private.
import { statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { eq, sql } from 'drizzle-orm';
import { Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';
import { smallImage, tinyPdf } from '../fixtures/uploads';
import { uploadLimits } from '@/lib/schemas/uploads';

const uploadDir = resolve(process.env.UPLOAD_DIR ?? '');

async function form(kind: string, file?: Buffer, name = 'photo.jpg', type = 'image/jpeg') {
  const f = new FormData();
  f.set('kind', kind);
  f.set('file', new Blob([new Uint8Array(file ?? (await smallImage('jpeg')))], { type }), name);
  return f;
}
const post = async (client: Client, caseId: string, body: FormData) => client.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body });
const countFor = async (caseId: string) => (await db.select({ n: sql<number>`count(*)::int` }).from(schema.uploads).where(eq(schema.uploads.caseId, caseId)))[0]!.n;

/** Rows standing in for files already sent (the quota counts rows and their sizes). */
async function fillCase(caseId: string, files: number, bytesEach: number) {
  await db.insert(schema.uploads).values(
    Array.from({ length: files }, () => ({ caseId, kind: 'other' as const, mimeType: 'image/jpeg', sizeBytes: bytesEach, sha256: 'x'.repeat(64), storageKey: `zz/${randomUUID()}.jpg` })),
  );
}

let admin: Client;
beforeAll(async () => {
  admin = (await newStaff('admin')).client;
});

describe('upload quotas and rate', () => {
  it(`refuses a file past ${uploadLimits.caseMaxFiles} files in one case with a clear 413, keeping nothing`, async () => {
    const { client, case: c } = await newCustomer();
    await fillCase(c!.id, uploadLimits.caseMaxFiles, 1000);
    const r = await post(client, c!.id, await form('meter_photo'));
    expect(r.status).toBe(413);
    expect(r.body.error.code).toBe('payload_too_large');
    expect(r.body.error.message).toContain(`${uploadLimits.caseMaxFiles} files`);
    expect(await countFor(c!.id)).toBe(uploadLimits.caseMaxFiles);
  });

  it('refuses a file that would pass the case’s total bytes', async () => {
    const { client, case: c } = await newCustomer();
    await fillCase(c!.id, 2, uploadLimits.caseMaxBytes / 2);
    const r = await post(client, c!.id, await form('meter_photo'));
    expect(r.status).toBe(413);
    expect(await countFor(c!.id)).toBe(2);
  });

  it('refuses uploads past the per-user rate with 429, counted in the shared store', async () => {
    const { client, user, case: c } = await newCustomer();
    // The hour's count, as another app process would have left it.
    await db.insert(schema.rateLimits).values({ key: `upload-user:${user.id}`, windowStart: new Date(), count: 60 });
    const r = await post(client, c!.id, await form('meter_photo'));
    expect(r.status).toBe(429);
    expect(r.body.error.code).toBe('rate_limited');
    expect(r.body.error.message).toMatch(/wait \d+ minutes/);
    expect(await countFor(c!.id)).toBe(0);
  });
});

describe('upload safety', () => {
  it('serves a PDF as a download in a sandbox, never inline', async () => {
    const { client, case: c } = await newCustomer();
    const up = await post(client, c!.id, await form('order_agreement', tinyPdf(), 'order.pdf', 'application/pdf'));
    expect(up.status).toBe(201);
    const res = await client.fetch(up.body.url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-disposition')).toMatch(/^attachment;/);
    expect(res.headers.get('content-security-policy')).toContain('sandbox');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    // Photos still show inline in the page.
    const photo = await post(client, c!.id, await form('meter_photo'));
    expect((await client.fetch(photo.body.url)).headers.get('content-disposition')).toMatch(/^inline;/);
  });

  it('does not let a customer delete what the office uploaded, but lets them delete their own', async () => {
    const { client, case: c } = await newCustomer();
    const theirs = await post(admin, c!.id, await form('meter_photo'));
    expect(theirs.status).toBe(201);
    const refused = await client.json(`/api/uploads/${theirs.body.id}`, { method: 'DELETE' });
    expect(refused.status).toBe(403);
    expect(await countFor(c!.id)).toBe(1);
    const mine = await post(client, c!.id, await form('cutout_photo'));
    expect((await client.json(`/api/uploads/${mine.body.id}`, { method: 'DELETE' })).status).toBe(200);
  });

  it('stores files readable by the app’s own user only', async () => {
    const { client, case: c } = await newCustomer();
    const up = await post(client, c!.id, await form('meter_photo'));
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, up.body.id));
    for (const key of [row!.storageKey, row!.thumbKey!]) {
      const mode = statSync(join(uploadDir, key)).mode;
      expect((mode & 0o077).toString(8), key).toBe('0');
    }
    expect((statSync(join(uploadDir, row!.storageKey, '..')).mode & 0o077).toString(8)).toBe('0');
  });
});
