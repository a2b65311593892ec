// Two app nodes on one database and one bucket, as `npm run cluster` and production run them:
// both started from the test stack's build (APP_ENTRY) with the S3 driver against the S3 fake,
// HAProxy from deploy/haproxy.cfg in front. Whatever one node does, the other must see.
import { spawn, type ChildProcess } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import net from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client, signInWithPassword } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { TEST_PASSWORD, signInWithLink } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';
import { smallImage } from '../fixtures/uploads';
import { S3Storage } from '@/lib/server/storage/s3.server';
import { ensureHaproxy, writeHaproxyConfig } from '../../scripts/lib/haproxy.mjs';

const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const srv = net.createServer();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });

async function waitForHealth(url: string, ms = 30_000) {
  const until = Date.now() + ms;
  for (;;) {
    try {
      if ((await fetch(`${url}/api/health`)).ok) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() > until) throw new Error(`${url} did not become healthy`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

const scratch = mkdtempSync(join(tmpdir(), 'groundwork-cluster-'));
const children: ChildProcess[] = [];
let nodeA: { url: string; process: ChildProcess };
let nodeB: { url: string; process: ChildProcess };
let lbUrl: string;

function startNode(name: string, port: number, appUrl: string): ChildProcess {
  const entry = process.env.APP_ENTRY;
  if (!entry) throw new Error('APP_ENTRY is not set: run this through `npm test`, which builds the app.');
  const child = spawn(process.execPath, [entry], {
    env: {
      ...process.env,
      PORT: String(port),
      HOST: '127.0.0.1',
      APP_URL: appUrl,
      STORAGE_DRIVER: 's3',
      // Scratch only: with the S3 driver nothing stays on a node's disk.
      UPLOAD_DIR: join(scratch, name),
    },
    stdio: ['ignore', 'ignore', 'ignore'],
  });
  children.push(child);
  return child;
}

beforeAll(async () => {
  const [portA, portB, lbPort] = [await freePort(), await freePort(), await freePort()];
  lbUrl = `http://127.0.0.1:${lbPort}`;
  nodeA = { url: `http://127.0.0.1:${portA}`, process: startNode('node-a', portA, lbUrl) };
  nodeB = { url: `http://127.0.0.1:${portB}`, process: startNode('node-b', portB, lbUrl) };
  const cfg = writeHaproxyConfig({
    file: join(scratch, 'haproxy.cfg'),
    listen: `127.0.0.1:${lbPort}`,
    nodes: [
      { name: 'node-a', port: portA },
      { name: 'node-b', port: portB },
    ],
    checkInterval: '250ms',
  });
  children.push(spawn(ensureHaproxy(), ['-db', '-f', cfg], { stdio: 'ignore' }));
  await Promise.all([waitForHealth(nodeA.url), waitForHealth(nodeB.url)]);
  await waitForHealth(lbUrl);
}, 60_000);

afterAll(async () => {
  await Promise.all(
    children.map(
      (c) =>
        new Promise<void>((done) => {
          if (c.exitCode !== null || c.signalCode !== null) return done();
          c.once('exit', () => done());
          c.kill('SIGTERM');
        }),
    ),
  );
  rmSync(scratch, { recursive: true, force: true });
});

const bucket = () =>
  new S3Storage({
    endpoint: process.env.S3_ENDPOINT,
    bucket: process.env.S3_BUCKET!,
    region: process.env.S3_REGION ?? 'us-east-1',
    accessKeyId: process.env.S3_ACCESS_KEY_ID,
    secretAccessKey: process.env.S3_SECRET_ACCESS_KEY,
    forcePathStyle: true,
  });

describe('two app nodes behind one load balancer', () => {
  it('a customer signs in through node A and uses the session on node B', async () => {
    const user = await createUser(db, { role: 'customer', name: 'Two Node Customer' });
    const c = await createCase(db, { customerId: user.id });
    const onA = await signInWithLink(user.email, 1, nodeA.url, lbUrl);
    const onB = onA.at(nodeB.url);
    expect((await onB.json('/api/me')).body).toMatchObject({ id: user.id, role: 'customer' });
    expect((await onB.json(`/api/cases/${c.id}`)).status).toBe(200);
    // Signing out is per browser: the cookie goes, and B refuses the request without it.
    expect((await new Client(nodeB.url).json('/api/me')).status).toBe(401);
  });

  it('an upload through node A downloads through node B, byte for byte, from the bucket', async () => {
    const user = await createUser(db, { role: 'customer' });
    const c = await createCase(db, { customerId: user.id });
    const onA = await signInWithLink(user.email, 1, nodeA.url, lbUrl);
    const form = new FormData();
    form.append('kind', 'meter_photo');
    form.append('file', new Blob([new Uint8Array(await smallImage('jpeg', 640, 480))], { type: 'image/jpeg' }), 'meter.jpg');
    const up = await onA.json(`/api/cases/${c.id}/uploads`, { method: 'POST', body: form });
    expect(up.status).toBe(201);
    const [row] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, up.body.id));

    const res = await onA.at(nodeB.url).fetch(up.body.url);
    const bytes = Buffer.from(await res.arrayBuffer());
    expect(res.status).toBe(200);
    expect(createHash('sha256').update(bytes).digest('hex')).toBe(row!.sha256);
    expect(res.headers.get('content-type')).toBe('image/jpeg');
    expect(res.headers.get('content-length')).toBe(String(row!.sizeBytes));
    expect(res.headers.get('content-disposition')).toBe(`inline; filename="meter.jpg"; filename*=UTF-8''meter.jpg`);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect((await onA.at(nodeB.url).fetch(up.body.thumbUrl)).headers.get('content-type')).toBe('image/webp');
    // The file is in the bucket, not on node A's disk.
    const store = bucket();
    expect(await store.exists(row!.storageKey)).toBe(true);
    expect(await store.exists(row!.thumbKey!)).toBe(true);
    store.close();

    // Deleted through B: gone from the bucket as well.
    expect((await onA.at(nodeB.url).json(up.body.url, { method: 'DELETE' })).status).toBe(200);
    const after = bucket();
    expect(await after.exists(row!.storageKey)).toBe(false);
    after.close();
  });

  // The limits live in PostgreSQL (rate_limits): kept in each process's memory, node B would
  // have counted nothing and answered 200 here.
  it('the sign-in limit counted on node A holds on node B', async () => {
    const user = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    for (let i = 0; i < 5; i++) {
      const r = await new Client(nodeA.url).authPost('/api/auth/callback/credentials', { email: user.email, password: `wrong-${i}`, callbackUrl: '/home' });
      expect(r.status).toBe(200);
    }
    const onB = await new Client(nodeB.url).authPost('/api/auth/callback/credentials', { email: user.email, password: 'wrong-5', callbackUrl: '/home' });
    expect(onB.status).toBe(429);
    expect(onB.body.error.code).toBe('rate_limited');
  });

  it('a stage move on node A is seen by node B', async () => {
    const admin = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    const customer = await createUser(db, { role: 'customer' });
    const c = await createCase(db, { customerId: customer.id, stage: 'sent_for_review' });
    const onA = await signInWithPassword(admin.email, TEST_PASSWORD, nodeA.url);
    expect((await onA.at(nodeB.url).json(`/api/cases/${c.id}`)).body.stage).toBe('sent_for_review');
    const moved = await onA.send('POST', `/api/cases/${c.id}/stage`, { to: 'in_review' });
    expect(moved.status).toBe(200);
    expect((await onA.at(nodeB.url).json(`/api/cases/${c.id}`)).body.stage).toBe('in_review');
    const queue = await onA.at(nodeB.url).json(`/api/cases?stage=in_review&q=${encodeURIComponent(customer.name ?? "")}`);
    expect(queue.body.items.map((i: { id: string }) => i.id)).toContain(c.id);
  });

  it('killing node A mid-traffic leaves node B serving, and no acknowledged write is lost', async () => {
    const admin = await createUser(db, { role: 'admin', password: TEST_PASSWORD });
    const customer = await createUser(db, { role: 'customer' });
    const c = await createCase(db, { customerId: customer.id });
    const viaLb = await signInWithPassword(admin.email, TEST_PASSWORD, lbUrl);
    // Both nodes in rotation before the traffic starts (HAProxy counts two good checks).
    const seen = new Set<string>();
    for (let i = 0; i < 100 && seen.size < 2; i++) {
      seen.add((await fetch(`${lbUrl}/api/health`)).headers.get('x-groundwork-node') ?? '?');
      if (seen.size < 2) await new Promise((r) => setTimeout(r, 50));
    }
    expect([...seen].sort()).toEqual(['node-a', 'node-b']);
    const servedBy: string[] = [];
    const acknowledged: string[] = [];

    // The browser's autosave retries a save that failed; so does this client.
    async function note(body: string) {
      for (let attempt = 0; attempt < 40; attempt++) {
        try {
          const r = await viaLb.send('POST', `/api/cases/${c.id}/notes`, { body });
          if (r.status === 201) {
            servedBy.push(r.res.headers.get('x-groundwork-node') ?? '?');
            acknowledged.push(body);
            return;
          }
          expect(r.status).toBeGreaterThanOrEqual(500);
        } catch {
          /* connection cut by the kill: try again */
        }
        await new Promise((r) => setTimeout(r, 100));
      }
      throw new Error(`note ${body} never saved`);
    }

    const total = 40;
    const writes: Promise<void>[] = [];
    for (let i = 0; i < total; i++) {
      // Two writers at a time, so requests are in flight on A when it dies.
      writes.push(note(`cluster note ${i}`));
      if (i % 2 === 1) await Promise.all(writes.splice(0));
      if (i === 15) nodeA.process.kill('SIGKILL');
    }
    await Promise.all(writes);

    expect(acknowledged).toHaveLength(total);
    // Round robin put work on A before the kill; after it only B answers.
    expect(servedBy.slice(0, 8)).toContain('node-a');
    expect(servedBy.slice(-10).every((n) => n === 'node-b')).toBe(true);
    const stored = await db.select({ body: schema.caseNotes.body }).from(schema.caseNotes).where(eq(schema.caseNotes.caseId, c.id));
    const bodies = stored.map((n) => n.body);
    for (const b of acknowledged) expect(bodies).toContain(b);
    // A request inside A when it died may have committed and then been sent again: at most those.
    expect(bodies.length - total).toBeLessThanOrEqual(2);
    expect((await new Client(nodeB.url).json('/api/health')).status).toBe(200);
    expect((await fetch(`${lbUrl}/api/health`)).status).toBe(200);
  });
});
