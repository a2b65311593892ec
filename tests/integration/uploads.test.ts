// Evidence uploads over real HTTP against the running app, with the real database and the real
// upload folder (UPLOAD_DIR, which scripts/test.mjs gives both the app and this process).
import { createHash, randomUUID } from 'node:crypto';
import { existsSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { join, resolve } from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, it } from 'vitest';
import { and, eq, sql } from 'drizzle-orm';
import { Client, baseUrl } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { newCustomer, newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';
import { GPS_IFD_POINTER, hugePng, ifd0Tags, jpegWithGps, listFiles, noisyJpeg, smallImage, tinyPdf } from '../fixtures/uploads';

type Signed = Awaited<ReturnType<typeof newCustomer>>;
const uploadDir = resolve(process.env.UPLOAD_DIR ?? '');
const MB = 1024 * 1024;

function form(kind: string | null, file: Buffer | null, name = 'photo.jpg', type = 'image/jpeg'): FormData {
  const f = new FormData();
  if (kind !== null) f.append('kind', kind);
  if (file) f.append('file', new Blob([new Uint8Array(file)], { type }), name);
  return f;
}

const post = (client: Client, caseId: string, body: FormData) => client.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body });

async function download(client: Client, path: string): Promise<{ res: Response; bytes: Buffer }> {
  const res = await client.fetch(path);
  return { res, bytes: Buffer.from(await res.arrayBuffer()) };
}

const rowsOf = (caseId: string) => db.select().from(schema.uploads).where(eq(schema.uploads.caseId, caseId));
const countRows = async () => (await db.select({ n: sql<number>`count(*)::int` }).from(schema.uploads))[0]!.n;

/** Runs a refused upload and checks it left nothing: same row count, same files on disk. */
async function expectNothingKept(run: () => Promise<{ status: number; body: any }>, status: number) {
  // An earlier refused upload may still be draining its scratch file on a busy machine: start clean.
  await waitFor(() => !listFiles(uploadDir).some((f) => f.startsWith('.incoming/')));
  const rowsBefore = await countRows();
  const filesBefore = listFiles(uploadDir);
  const r = await run();
  expect(r.status).toBe(status);
  expect(typeof r.body.error.message).toBe('string');
  // The scratch file of a refused upload is removed as the refusal is answered; allow the drain a moment.
  await waitFor(() => JSON.stringify(listFiles(uploadDir)) === JSON.stringify(filesBefore));
  expect(listFiles(uploadDir)).toEqual(filesBefore);
  expect(await countRows()).toBe(rowsBefore);
  return r;
}

async function waitFor(ok: () => boolean | Promise<boolean>, ms = 5000) {
  const until = Date.now() + ms;
  while (!(await ok()) && Date.now() < until) await new Promise((r) => setTimeout(r, 50));
}

/** A hand-made multipart body sent as a stream (chunked, so no Content-Length is declared). */
function multipartStream(kind: string, fileHead: Buffer, fillerBytes: number, name = 'big.jpg') {
  const boundary = `----groundwork${randomUUID()}`;
  const head = Buffer.from(
    `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\n${kind}\r\n` +
      `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="${name}"\r\nContent-Type: image/jpeg\r\n\r\n`,
  );
  const tail = Buffer.from(`\r\n--${boundary}--\r\n`);
  const chunk = Buffer.alloc(64 * 1024);
  let left = fillerBytes;
  const body = new ReadableStream<Uint8Array>({
    start(c) {
      c.enqueue(head);
      c.enqueue(fileHead);
    },
    pull(c) {
      if (left <= 0) {
        c.enqueue(tail);
        c.close();
        return;
      }
      const n = Math.min(left, chunk.length);
      left -= n;
      c.enqueue(chunk.subarray(0, n));
    },
  });
  return { body, contentType: `multipart/form-data; boundary=${boundary}` };
}

// JPEG files begin with SOI (FF D8) and a marker (ITU-T T.81 Annex B); file-type needs just that.
const JPEG_HEAD = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, 0x4a, 0x46, 0x49, 0x46, 0x00, 0x01]);

describe('POST /api/cases/:id/uploads', () => {
  let c: Signed;
  beforeAll(async () => {
    c = await newCustomer({ addressLine1: '3 Rowan Close', town: 'Quillbury' });
  });

  it('re-encodes a phone JPEG: GPS, camera and serial EXIF gone, orientation applied, thumbnail made', async () => {
    const original = await jpegWithGps();
    // The fixture really carries what we want removed (EXIF 2.3 §4.6.3: GPS Info IFD pointer 0x8825).
    const sent = await sharp(original).metadata();
    expect(ifd0Tags(sent.exif)).toContain(GPS_IFD_POINTER);
    expect(sent.exif!.includes(Buffer.from('SN-0000-TEST'))).toBe(true);
    expect([sent.width, sent.height, sent.orientation]).toEqual([800, 600, 6]);

    const r = await post(c.client, c.case!.id, form('cutout_photo', original, 'IMG_0042.JPG'));
    expect(r.status).toBe(201);
    // Orientation 6 means "rotate 90° clockwise to view" (EXIF 2.3 tag 0x0112): 800×600 becomes 600×800.
    expect(r.body).toMatchObject({ kind: 'cutout_photo', status: 'waiting', mimeType: 'image/jpeg', width: 600, height: 800, originalName: 'IMG_0042.JPG' });
    expect(r.body.url).toBe(`/api/uploads/${r.body.id}`);
    expect(r.body.thumbUrl).toBe(`/api/uploads/${r.body.id}?size=thumb`);
    expect(r.res.headers.get('location')).toBe(r.body.url);
    expect(Date.parse(r.body.createdAt)).toBeGreaterThan(Date.now() - 60_000);

    const { res, bytes } = await download(c.client, r.body.url);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    const kept = await sharp(bytes).metadata();
    expect(kept.exif).toBeUndefined();
    expect(kept.icc).toBeUndefined();
    expect(kept.xmp).toBeUndefined();
    expect(ifd0Tags(kept.exif)).not.toContain(GPS_IFD_POINTER);
    expect(bytes.includes(Buffer.from('ExampleCam'))).toBe(false);
    expect(bytes.includes(Buffer.from('SN-0000-TEST'))).toBe(false);
    expect([kept.width, kept.height]).toEqual([600, 800]);
    expect(bytes.equals(original)).toBe(false);

    // The row describes the stored bytes, not the sent ones.
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, r.body.id));
    expect(row!.sha256).toBe(createHash('sha256').update(bytes).digest('hex'));
    expect(row!.sizeBytes).toBe(bytes.length);
    expect(r.body.sizeBytes).toBe(bytes.length);
    expect(row!.uploadedBy).toBe(c.user.id);

    // 480 px wide WebP preview: 600×800 scaled to width 480 keeps 3:4, so 480×640.
    const thumb = await download(c.client, r.body.thumbUrl);
    expect(thumb.res.headers.get('content-type')).toBe('image/webp');
    const tm = await sharp(thumb.bytes).metadata();
    expect([tm.format, tm.width, tm.height, tm.exif]).toEqual(['webp', 480, 640, undefined]);

    // Both files sit under UPLOAD_DIR by id.
    expect(existsSync(join(uploadDir, row!.storageKey))).toBe(true);
    expect(existsSync(join(uploadDir, row!.thumbKey!))).toBe(true);
    expect(row!.storageKey).toBe(`${row!.id.slice(0, 2)}/${row!.id}.jpg`);

    const trail = await db.select().from(schema.auditLog).where(and(eq(schema.auditLog.entityId, r.body.id), eq(schema.auditLog.action, 'upload.added')));
    expect(trail).toHaveLength(1);
    expect(trail[0]!.actorId).toBe(c.user.id);
  });

  it('keeps a PNG as PNG and a WebP as WebP', async () => {
    const png = await post(c.client, c.case!.id, form('meter_photo', await smallImage('png'), 'meter.png', 'image/png'));
    expect(png.status).toBe(201);
    expect(png.body).toMatchObject({ mimeType: 'image/png', width: 320, height: 240 });
    const webp = await post(c.client, c.case!.id, form('consumer_unit_photo', await smallImage('webp'), 'cu.webp', 'image/webp'));
    expect(webp.status).toBe(201);
    expect(webp.body.mimeType).toBe('image/webp');
    const { bytes } = await download(c.client, webp.body.url);
    expect((await sharp(bytes).metadata()).format).toBe('webp');
  });

  it('stores a PDF as it was sent (documents are not re-encoded), without a thumbnail', async () => {
    const pdf = tinyPdf();
    const r = await post(c.client, c.case!.id, form('order_agreement', pdf, 'order.pdf', 'application/pdf'));
    expect(r.status).toBe(201);
    expect(r.body).toMatchObject({ mimeType: 'application/pdf', width: null, height: null, thumbUrl: null, sizeBytes: pdf.length });
    const { res, bytes } = await download(c.client, r.body.url);
    expect(res.headers.get('content-type')).toBe('application/pdf');
    expect(bytes.equals(pdf)).toBe(true);
    expect((await c.client.json(`${r.body.url}?size=thumb`)).status).toBe(404);
  });

  it('decides the type from the content: a text file named .jpg and sent as image/jpeg gets 415', async () => {
    const text = Buffer.from('This is not a photo at all, just some words.\n'.repeat(200));
    const r = await expectNothingKept(() => post(c.client, c.case!.id, form('meter_photo', text, 'meter.jpg', 'image/jpeg')), 415);
    expect(r.body.error.code).toBe('unsupported_media_type');
    expect(r.body.error.message).toMatch(/JPEG, PNG or WebP/);
  });

  it('refuses a PDF where a photo is asked for (415), and a PDF that is cut short (422)', async () => {
    await expectNothingKept(() => post(c.client, c.case!.id, form('cutout_photo', tinyPdf(), 'fuse.pdf', 'application/pdf')), 415);
    const cut = tinyPdf().subarray(0, 120);
    const r = await expectNothingKept(() => post(c.client, c.case!.id, form('order_agreement', cut, 'order.pdf', 'application/pdf')), 422);
    expect(r.body.error.fields).toHaveProperty('file');
  });

  it('answers an iPhone HEIC photo with how to send a JPEG instead, when this machine cannot decode HEIC', async () => {
    // ISO/IEC 23008-12 (HEIF): an ISO BMFF "ftyp" box with major brand "heic".
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 0x18]), Buffer.from('ftypheic\0\0\0\0mif1heic'), Buffer.alloc(5000)]);
    const decodable = Boolean(sharp.format.heif?.input?.fileSuffix?.includes('.heic'));
    const r = await post(c.client, c.case!.id, form('meter_photo', heic, 'IMG_0001.HEIC', 'image/heic'));
    if (decodable) {
      expect(r.status).toBe(422); // not a real picture inside, but the type was accepted
    } else {
      expect(r.status).toBe(415);
      expect(r.body.error.message).toContain('Settings → Camera → Formats');
      expect(r.body.error.message).toContain('Most Compatible');
    }
  });

  it('a 25 MB file gets 413 (its Content-Length is already over the limit), and nothing is kept', async () => {
    const big = Buffer.concat([JPEG_HEAD, Buffer.alloc(25 * MB)]);
    const r = await expectNothingKept(() => post(c.client, c.case!.id, form('meter_photo', big, 'big.jpg')), 413);
    expect(r.body.error.code).toBe('payload_too_large');
    expect(r.body.error.message).toContain('15 MB');
  });

  it('a 25 MB file sent without a Content-Length is cut off at 15 MB with 413', async () => {
    const { body, contentType } = multipartStream('meter_photo', JPEG_HEAD, 25 * MB);
    const r = await expectNothingKept(
      () => c.client.json(`/api/cases/${c.case!.id}/uploads`, { method: 'POST', body, headers: { 'content-type': contentType }, duplex: 'half' } as RequestInit),
      413,
    );
    expect(r.body.error.message).toContain('15 MB');
  });

  it('answers 413 at the limit without waiting for the rest of the body', async () => {
    // Send 16 MB of a 40 MB declared body, then hold: the answer must come before the body ends.
    const boundary = `----groundwork${randomUUID()}`;
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\nmeter_photo\r\n` +
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="x.jpg"\r\n\r\n`,
    );
    const status = await new Promise<number>((done, fail) => {
      const req = httpRequest(new URL(`/api/cases/${c.case!.id}/uploads`, baseUrl), {
        method: 'POST',
        headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, 'transfer-encoding': 'chunked', cookie: c.client.cookieHeader(), origin: baseUrl },
      });
      req.on('response', (res) => {
        done(res.statusCode ?? 0);
        res.resume();
        req.destroy();
      });
      req.on('error', (e) => (e.message.includes('socket hang up') ? undefined : fail(e)));
      req.write(head);
      req.write(JPEG_HEAD);
      const chunk = Buffer.alloc(MB);
      for (let i = 0; i < 16; i++) req.write(chunk);
      setTimeout(() => fail(new Error('no answer within 10 s: the body was not cut off at the limit')), 10_000).unref();
    });
    expect(status).toBe(413);
  });

  it('a PDF over 10 MB gets 413 (PDFs have the smaller limit)', async () => {
    const pdf = tinyPdf(11 * MB);
    const r = await expectNothingKept(() => post(c.client, c.case!.id, form('order_agreement', pdf, 'big.pdf', 'application/pdf')), 413);
    expect(r.body.error.message).toContain('10 MB');
  });

  it('a 20000×20000 PNG (400 megapixels, over the 40 limit) gets 422 before it is decoded', async () => {
    const png = await hugePng();
    // Small on the wire, huge when decoded: 20000 × 20000 = 400,000,000 pixels.
    expect(png.length).toBeLessThan(MB);
    const m = await sharp(png, { limitInputPixels: false }).metadata();
    expect([m.width, m.height]).toEqual([20_000, 20_000]);
    const r = await expectNothingKept(() => post(c.client, c.case!.id, form('meter_photo', png, 'huge.png', 'image/png')), 422);
    expect(r.body.error.message).toContain('400 megapixels');
  }, 60_000);

  it('a file that looks like a JPEG but cannot be decoded gets 422', async () => {
    const broken = Buffer.concat([JPEG_HEAD, Buffer.from('garbage'.repeat(1000))]);
    const r = await expectNothingKept(() => post(c.client, c.case!.id, form('meter_photo', broken, 'broken.jpg')), 422);
    expect(r.body.error.message).toMatch(/could not open/);
  });

  it('stores a path-traversal file name safely: only the sanitised base name is kept, the file is named by id', async () => {
    const r = await post(c.client, c.case!.id, form('meter_photo', await smallImage('jpeg'), '../../etc/passwd\u202e.jpg'));
    expect(r.status).toBe(201);
    expect(r.body.originalName).toBe('passwd.jpg');
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, r.body.id));
    expect(row!.originalName).toBe('passwd.jpg');
    const stored = resolve(uploadDir, row!.storageKey);
    expect(stored.startsWith(uploadDir + '/')).toBe(true);
    expect(existsSync(stored)).toBe(true);
    expect(listFiles(uploadDir).filter((f) => f.includes('passwd'))).toEqual([]);
    expect(existsSync(resolve(uploadDir, '../../etc/passwd.jpg'))).toBe(false);
    const { res } = await download(c.client, r.body.url);
    expect(res.headers.get('content-disposition')).toBe(`inline; filename="passwd.jpg"; filename*=UTF-8''passwd.jpg`);
  });

  it('refuses a missing or unknown kind, a missing file, and a body that is not multipart', async () => {
    const jpeg = await smallImage('jpeg');
    const noKind = await expectNothingKept(() => post(c.client, c.case!.id, form(null, jpeg)), 422);
    expect(noKind.body.error.fields).toHaveProperty('kind');
    const badKind = await expectNothingKept(() => post(c.client, c.case!.id, form('selfie', jpeg)), 422);
    expect(badKind.body.error.fields).toHaveProperty('kind');
    const noFile = await expectNothingKept(() => post(c.client, c.case!.id, form('meter_photo', null)), 422);
    expect(noFile.body.error.fields).toHaveProperty('file');
    const json = await expectNothingKept(() => c.client.send('POST', `/api/cases/${c.case!.id}/uploads`, { kind: 'meter_photo' }), 415);
    expect(json.body.error.code).toBe('unsupported_media_type');
  });

  it('leaves no file and no row when the sender goes away mid-upload', async () => {
    const rowsBefore = await countRows();
    const filesBefore = listFiles(uploadDir);
    const boundary = `----groundwork${randomUUID()}`;
    const head = Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="kind"\r\n\r\nmeter_photo\r\n` +
        `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="x.jpg"\r\n\r\n`,
    );
    const photo = await noisyJpeg(1200, 1200);
    const req = httpRequest(new URL(`/api/cases/${c.case!.id}/uploads`, baseUrl), {
      method: 'POST',
      headers: {
        'content-type': `multipart/form-data; boundary=${boundary}`,
        'content-length': String(head.length + photo.length + 100),
        cookie: c.client.cookieHeader(),
        origin: baseUrl,
      },
    });
    req.on('error', () => {});
    req.write(head);
    req.write(photo.subarray(0, photo.length / 2));
    // The partial file shows up in the scratch folder while the upload is under way…
    await waitFor(() => listFiles(uploadDir).some((f) => f.startsWith('.incoming/')));
    expect(listFiles(uploadDir).some((f) => f.startsWith('.incoming/'))).toBe(true);
    req.destroy();
    // …and is gone once the connection drops.
    await waitFor(() => JSON.stringify(listFiles(uploadDir)) === JSON.stringify(filesBefore));
    expect(listFiles(uploadDir)).toEqual(filesBefore);
    expect(await countRows()).toBe(rowsBefore);
  });
});

describe('who may send, see and delete uploads', () => {
  let owner: Signed;
  let other: Signed;
  let uploadId: string;
  beforeAll(async () => {
    owner = await newCustomer({});
    other = await newCustomer({});
    const r = await post(owner.client, owner.case!.id, form('meter_photo', await smallImage('jpeg'), 'meter.jpg'));
    expect(r.status).toBe(201);
    uploadId = r.body.id;
  });

  it('another customer gets 404 for the list, the file, the thumbnail, a new upload and a delete', async () => {
    expect((await other.client.json(`/api/cases/${owner.case!.id}/uploads`)).status).toBe(404);
    expect((await other.client.json(`/api/uploads/${uploadId}`)).status).toBe(404);
    expect((await other.client.json(`/api/uploads/${uploadId}?size=thumb`)).status).toBe(404);
    expect((await post(other.client, owner.case!.id, form('meter_photo', await smallImage('jpeg')))).status).toBe(404);
    expect((await other.client.json(`/api/uploads/${uploadId}`, { method: 'DELETE' })).status).toBe(404);
    expect(await rowsOf(owner.case!.id)).toHaveLength(1);
  });

  it('anonymous callers get 401 everywhere', async () => {
    const anon = new Client();
    expect((await anon.json(`/api/cases/${owner.case!.id}/uploads`)).status).toBe(401);
    expect((await anon.json(`/api/uploads/${uploadId}`)).status).toBe(401);
    expect((await post(anon, owner.case!.id, form('meter_photo', await smallImage('jpeg')))).status).toBe(401);
    expect((await anon.json(`/api/uploads/${uploadId}`, { method: 'DELETE' })).status).toBe(401);
  });

  it('the office sees every case’s files and may upload; a surveyor only for cases assigned to them', async () => {
    const admin = await newStaff('admin');
    expect((await admin.client.json(`/api/uploads/${uploadId}`)).status).toBe(200);
    const byOffice = await post(admin.client, owner.case!.id, form('other', tinyPdf(), 'letter.pdf', 'application/pdf'));
    expect(byOffice.status).toBe(201);
    const surveyor = await newStaff('surveyor');
    expect((await surveyor.client.json(`/api/uploads/${uploadId}`)).status).toBe(404);
    expect((await surveyor.client.json(`/api/cases/${owner.case!.id}/uploads`)).status).toBe(404);
    const customer = await createUser(db, { role: 'customer' });
    const assigned = await createCase(db, { customerId: customer.id, surveyorId: surveyor.user.id });
    const [row] = await db
      .insert(schema.uploads)
      .values({ caseId: assigned.id, kind: 'meter_photo', mimeType: 'image/jpeg', sizeBytes: 1, sha256: '0'.repeat(64), storageKey: `zz/${randomUUID()}.jpg` })
      .returning();
    const list = await surveyor.client.json(`/api/cases/${assigned.id}/uploads`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((i: { id: string }) => i.id)).toEqual([row!.id]);
    // The assigned surveyor may add photos from site; a surveyor not assigned gets 404.
    const site = await post(surveyor.client, assigned.id, form('other', await smallImage('jpeg')));
    expect(site.status).toBe(201);
    expect(site.body.kind).toBe('other');
    expect((await post(surveyor.client, owner.case!.id, form('other', await smallImage('jpeg')))).status).toBe(404);
  });

  it('lists the case’s uploads oldest first, each with its links and status, and filters by kind', async () => {
    const second = await post(owner.client, owner.case!.id, form('charger_location_photo', await smallImage('png'), 'wall.png', 'image/png'));
    const list = await owner.client.json(`/api/cases/${owner.case!.id}/uploads`);
    expect(list.status).toBe(200);
    const items = list.body.items as Array<Record<string, unknown>>;
    expect(items.map((i) => i.kind)).toEqual(['meter_photo', 'other', 'charger_location_photo']);
    expect(items[2]).toEqual(second.body);
    expect(Object.keys(items[0]!).sort()).toEqual(
      ['createdAt', 'height', 'id', 'kind', 'mimeType', 'originalName', 'quality', 'reason', 'reviewedAt', 'sizeBytes', 'status', 'thumbUrl', 'url', 'width'].sort(),
    );
    const meters = await owner.client.json(`/api/cases/${owner.case!.id}/uploads?kind=meter_photo`);
    expect(meters.body.items.map((i: { id: string }) => i.id)).toEqual([uploadId]);
    expect((await owner.client.json(`/api/cases/${owner.case!.id}/uploads?kind=selfie`)).status).toBe(400);
  });

  it('serves files with their type, a safe inline name, nosniff and private caching', async () => {
    const { res } = await download(owner.client, `/api/uploads/${uploadId}`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('cache-control')).toMatch(/^private, max-age=\d+$/);
    // RFC 6266 §4.1 and §4.3: disposition type, an ASCII filename, and filename* (RFC 8187) in UTF-8.
    expect(res.headers.get('content-disposition')).toBe(`inline; filename="meter.jpg"; filename*=UTF-8''meter.jpg`);
    const thumb = await download(owner.client, `/api/uploads/${uploadId}?size=thumb`);
    expect(thumb.res.headers.get('content-disposition')).toBe(`inline; filename="meter-preview.webp"; filename*=UTF-8''meter-preview.webp`);
  });

  it('gives a non-ASCII name an ASCII fallback and a percent-encoded filename*', async () => {
    const r = await post(owner.client, owner.case!.id, form('other', await smallImage('jpeg'), 'Zoë’s "fuse".jpg'));
    const { res } = await download(owner.client, r.body.url);
    // RFC 8187 §3.2.1: UTF-8 bytes percent-encoded; ë = C3 AB, ’ = E2 80 99, " = 22, space = 20.
    expect(res.headers.get('content-disposition')).toBe(
      `inline; filename="Zo__s _fuse_.jpg"; filename*=UTF-8''Zo%C3%AB%E2%80%99s%20%22fuse%22.jpg`,
    );
  });

  it('lets the customer delete an upload not yet accepted: row, file and thumbnail go, with an audit entry', async () => {
    const r = await post(owner.client, owner.case!.id, form('meter_photo', await smallImage('jpeg'), 'again.jpg'));
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, r.body.id));
    expect(existsSync(join(uploadDir, row!.storageKey))).toBe(true);
    const del = await owner.client.json(`/api/uploads/${r.body.id}`, { method: 'DELETE' });
    expect(del.status).toBe(200);
    expect(await db.select().from(schema.uploads).where(eq(schema.uploads.id, r.body.id))).toEqual([]);
    expect(existsSync(join(uploadDir, row!.storageKey))).toBe(false);
    expect(existsSync(join(uploadDir, row!.thumbKey!))).toBe(false);
    expect((await owner.client.json(r.body.url)).status).toBe(404);
    const trail = await db.select().from(schema.auditLog).where(eq(schema.auditLog.entityId, r.body.id));
    expect(trail.map((t) => t.action).sort()).toEqual(['upload.added', 'upload.deleted']);
  });

  it('refuses to delete an accepted upload with 409, and a rejected one shows its reason and can go', async () => {
    await db.update(schema.uploads).set({ status: 'accepted', reviewedAt: new Date() }).where(eq(schema.uploads.id, uploadId));
    const del = await owner.client.json(`/api/uploads/${uploadId}`, { method: 'DELETE' });
    expect(del.status).toBe(409);
    expect(del.body.error.code).toBe('conflict');
    expect(await db.select().from(schema.uploads).where(eq(schema.uploads.id, uploadId))).toHaveLength(1);
    expect((await owner.client.fetch(`/api/uploads/${uploadId}`)).status).toBe(200);

    const r = await post(owner.client, owner.case!.id, form('cutout_photo', await smallImage('jpeg'), 'blurry.jpg'));
    await db.update(schema.uploads).set({ status: 'rejected', reason: 'The rating is not readable.' }).where(eq(schema.uploads.id, r.body.id));
    const list = await owner.client.json(`/api/cases/${owner.case!.id}/uploads?kind=cutout_photo`);
    expect(list.body.items[0]).toMatchObject({ status: 'rejected', reason: 'The rating is not readable.' });
    expect((await owner.client.json(`/api/uploads/${r.body.id}`, { method: 'DELETE' })).status).toBe(200);
  });

  it('only the customer deletes: the office gets 403 (it rejects instead)', async () => {
    const r = await post(owner.client, owner.case!.id, form('meter_photo', await smallImage('jpeg')));
    const admin = await newStaff('admin');
    expect((await admin.client.json(`/api/uploads/${r.body.id}`, { method: 'DELETE' })).status).toBe(403);
  });
});
