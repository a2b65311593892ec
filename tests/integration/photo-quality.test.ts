// The photo check at upload over real HTTP against the running app, with the real database: the
// upload's answer carries `quality`, the row keeps it and the hash, duplicates are found across
// slots, the office's queue filters on it (API and CSV), and a rejection can reuse its words.
// The photos are drawn in the test (tests/fixtures/photo-quality.ts); the measures and their
// sources are in tests/unit/photo-quality.test.ts (thresholds: common practice — no published source).
import { beforeAll, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { eq } from 'drizzle-orm';
import type { Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { newStaff, signInWithLink } from '../helpers/people';
import { messagesTo, waitForMessage } from '../helpers/mail';
import { createCase, createUser } from '../../seeds/factories';
import { rejectionWords } from '@/lib/photo-quality';
import { sharpPhoto, spoil } from '../fixtures/photo-quality';
import { tinyPdf } from '../fixtures/uploads';

const marker = `Pq${Date.now().toString(36)}`;

function form(kind: string, file: Buffer, name = 'photo.jpg', type = 'image/jpeg'): FormData {
  const f = new FormData();
  f.append('kind', kind);
  f.append('file', new Blob([new Uint8Array(file)], { type }), name);
  return f;
}

async function customerWithCase(name: string) {
  const user = await createUser(db, { role: 'customer', name: `${marker} ${name}`, email: `${marker.toLowerCase()}-${name.toLowerCase()}@example.org` });
  const row = await createCase(db, { customerId: user.id, addressLine1: '4 Alder Walk', town: 'Quillbury', postcode: 'AB2 4CD' });
  return { user, row, client: await signInWithLink(user.email) };
}

const send = (client: Client, caseId: string, body: FormData) => client.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body });
const codesOf = (body: { quality: { problems: { code: string }[] } }) => body.quality.problems.map((p) => p.code);

let admin: Client;
let flagged: Awaited<ReturnType<typeof customerWithCase>>;
let clean: Awaited<ReturnType<typeof customerWithCase>>;
const photo: { sharp: Buffer; other: Buffer } = { sharp: Buffer.alloc(0), other: Buffer.alloc(0) };

beforeAll(async () => {
  admin = (await newStaff('admin')).client;
  [flagged, clean] = [await customerWithCase('Flagged'), await customerWithCase('Clean')];
  photo.sharp = await sharpPhoto(1);
  photo.other = await sharpPhoto(2);
}, 60_000);

describe('POST /api/cases/:id/uploads answers the photo check', () => {
  it('finds nothing wrong with a sharp, well-lit, full-size photo, and keeps the figures and the hash', async () => {
    const r = await send(flagged.client, flagged.row.id, form('cutout_photo', photo.sharp, 'fuse.jpg'));
    expect(r.status).toBe(201);
    expect(r.body.quality).toMatchObject({ ok: true, problems: [] });
    expect(r.body.quality.measures).toMatchObject({ longEdge: 2560, shortEdge: 1920 });
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, r.body.id));
    expect(row!.qualityOk).toBe(true);
    expect(row!.perceptualHash).toMatch(/^[0-9a-f]{16}$/);
  });

  it('flags a blurred copy of it in another slot as blurred and as the same photo, each with code, message, figure and threshold', async () => {
    const r = await send(flagged.client, flagged.row.id, form('meter_photo', await spoil.blurred(photo.sharp), 'meter.jpg'));
    expect(r.status).toBe(201); // the check advises; the photo is kept
    expect(r.body.quality.ok).toBe(false);
    expect(codesOf(r.body)).toEqual(['blurry', 'duplicate']);
    for (const p of r.body.quality.problems) {
      expect(Object.keys(p).sort()).toEqual(['code', 'measure', 'measured', 'message', 'threshold']);
      expect(typeof p.measured).toBe('number');
      expect(typeof p.threshold).toBe('number');
    }
    const [blurry, duplicate] = r.body.quality.problems;
    expect(blurry.measured).toBeLessThan(blurry.threshold);
    expect(duplicate.message).toBe('This looks like the same photo as your photo of the main fuse (cut-out).');
    expect(duplicate.threshold).toBe(6);
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, r.body.id));
    expect(row!.qualityOk).toBe(false);
  });

  it('flags a darkened, an over-exposed and a shrunk photo for what each is, and a retake in the same slot is no duplicate', async () => {
    const dark = await send(flagged.client, flagged.row.id, form('consumer_unit_photo', await spoil.darkened(photo.other)));
    expect(codesOf(dark.body)).toEqual(['too_dark']);
    const bright = await send(flagged.client, flagged.row.id, form('consumer_unit_photo', await spoil.overExposed(photo.other)));
    expect(codesOf(bright.body)).toEqual(['too_bright']);
    const small = await send(flagged.client, flagged.row.id, form('consumer_unit_photo', await spoil.downScaled(photo.other)));
    expect(codesOf(small.body)).toEqual(['too_small']);
    expect(small.body.quality.problems[0]).toMatchObject({ measured: 960, threshold: 1200 });
  });

  it('answers quality: null for a PDF, and the list carries each photo’s check', async () => {
    const pdf = await send(flagged.client, flagged.row.id, form('order_agreement', tinyPdf(), 'order.pdf', 'application/pdf'));
    expect(pdf.status).toBe(201);
    expect(pdf.body.quality).toBeNull();
    const list = await flagged.client.json(`/api/cases/${flagged.row.id}/uploads`);
    expect(list.body.items.map((i: { kind: string; quality: { ok: boolean } | null }) => [i.kind, i.quality?.ok ?? null])).toEqual([
      ['cutout_photo', true],
      ['meter_photo', false],
      ['consumer_unit_photo', false],
      ['consumer_unit_photo', false],
      ['consumer_unit_photo', false],
      ['order_agreement', null],
    ]);
  });
});

describe('the office queue filters on flagged photos', () => {
  const queue = (query: string) => admin.json(`/api/cases?q=${marker}&${query}`);

  it('shows only cases with a flagged photo still waiting for review, with their count, in the API and the CSV', async () => {
    const ok = await send(clean.client, clean.row.id, form('cutout_photo', photo.other));
    expect(ok.body.quality.ok).toBe(true);

    const all = await queue('');
    expect(all.body.total).toBe(2);
    const only = await queue('photos=flagged');
    expect(only.status).toBe(200);
    expect(only.body.items.map((i: { id: string; flaggedPhotos: number }) => [i.id, i.flaggedPhotos])).toEqual([[flagged.row.id, 4]]);

    const csv = await admin.fetch(`/api/cases.csv?q=${marker}&photos=flagged`);
    const rows = Papa.parse<string[]>((await csv.text()).trim()).data;
    expect(rows[0]!.at(-1)).toBe('Photos flagged');
    expect(rows.slice(1).map((r) => [r[0], r.at(-1)])).toEqual([[flagged.row.reference, '4']]);

    const bad = await queue('photos=maybe');
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty('photos');
  });

  it('drops a case from the filter once the office has reviewed every flagged photo', async () => {
    const list = (await admin.json(`/api/cases/${flagged.row.id}/uploads`)).body.items as { id: string; quality: { ok: boolean } | null }[];
    for (const item of list.filter((i) => i.quality && !i.quality.ok)) {
      expect((await admin.send('POST', `/api/uploads/${item.id}/review`, { decision: 'accepted' })).status).toBe(200);
    }
    expect((await queue('photos=flagged')).body.total).toBe(0);
  });
});

describe('a rejection that reuses the check’s words', () => {
  it('e-mails the customer what the check found and what a good photo shows, and keeps no sign-in link in the log', async () => {
    const sent = await send(clean.client, clean.row.id, form('meter_photo', await spoil.blurred(photo.sharp)));
    expect(codesOf(sent.body)).toEqual(['blurry']);
    const reason = rejectionWords('meter_photo', sent.body.quality.problems);
    const before = (await messagesTo(clean.user.email)).length;
    const r = await admin.send('POST', `/api/uploads/${sent.body.id}/review`, { decision: 'rejected', reason });
    expect(r.status).toBe(200);
    const mail = await waitForMessage(clean.user.email, before + 1);
    expect(mail.text).toContain('This photo looks blurred, so the small print on it may not be readable.');
    expect(mail.text).toContain('Get the whole meter in');
    const logged = (await admin.json(`/api/cases/${clean.row.id}/emails`)).body.items.find((i: { kind: string }) => i.kind === 'rejection');
    expect(logged.text).toContain('This photo looks blurred');
    expect(logged.text).not.toContain('/api/auth/callback/nodemailer');
  });
});
