// Uploads leave nothing half-done: an app killed mid-upload leaves no row without its file, and
// the storage sweep (a pg-boss job in the worker) removes stray temporary files, files no row
// refers to and files of deleted cases once older than its grace period, keeping everything else.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync, utimesSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import net from 'node:net';
import { eq } from 'drizzle-orm';
import PgBoss from 'pg-boss';
import { describe, expect, it } from 'vitest';
import { LocalDiskStorage } from '@/lib/server/storage/local-disk.server';
import { STORAGE_SWEEP_QUEUE, sweepStorage } from '@/lib/server/storage-sweep.server';
import { db, schema, sql } from '../helpers/db';
import { newCustomer } from '../helpers/people';
import { listFiles, noisyJpeg, smallImage } from '../fixtures/uploads';

const uploadDir = resolve(process.env.UPLOAD_DIR ?? '');
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const hoursAgo = (h: number) => new Date(Date.now() - h * 3_600_000);

function photoForm(bytes: Buffer): FormData {
  const f = new FormData();
  f.append('kind', 'meter_photo');
  f.append('file', new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), 'meter.jpg');
  return f;
}

function stray(dir: string, key: string, age: Date | null) {
  const path = join(dir, key);
  mkdirSync(resolve(path, '..'), { recursive: true });
  writeFileSync(path, 'left behind');
  if (age) utimesSync(path, age, age);
  return path;
}

async function runSweepJob(graceMinutes: number) {
  const boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, schema: 'pgboss', max: 1, supervise: false, schedule: false });
  boss.on('error', () => {});
  await boss.start();
  const id = await boss.send(STORAGE_SWEEP_QUEUE, { graceMinutes });
  await boss.stop({ graceful: false, wait: false });
  for (let i = 0; i < 150; i++) {
    const [job] = await sql`select state, output from pgboss.job where id = ${id!}`;
    if (job?.state === 'completed') return job.output as { removedTemporary: { key: string }[]; removedUnreferenced: { key: string }[] };
    if (job?.state === 'failed') throw new Error(`sweep job failed: ${JSON.stringify(job.output)}`);
    await sleep(200);
  }
  throw new Error('the worker did not complete the sweep job within 30 s');
}

describe('the storage sweep (worker job)', () => {
  it('removes old stray and orphaned files, and files of deleted cases; keeps fresh ones and those with a row', async () => {
    const keeper = await newCustomer({});
    const doomed = await newCustomer({});
    const kept = await keeper.client.json(`/api/cases/${keeper.case!.id}/uploads`, { method: 'POST', body: photoForm(await smallImage('jpeg')) });
    const gone = await doomed.client.json(`/api/cases/${doomed.case!.id}/uploads`, { method: 'POST', body: photoForm(await smallImage('jpeg')) });
    expect([kept.status, gone.status]).toEqual([201, 201]);
    const [keptRow] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, kept.body.id));
    const [goneRow] = await db.select().from(schema.uploads).where(eq(schema.uploads.id, gone.body.id));
    // Every file is made to look two hours old; only being referenced should save it.
    for (const key of [keptRow!.storageKey, keptRow!.thumbKey!, goneRow!.storageKey, goneRow!.thumbKey!]) utimesSync(join(uploadDir, key), hoursAgo(2), hoursAgo(2));
    // The case is deleted: its upload rows go with it (ON DELETE CASCADE), its files do not.
    await db.delete(schema.auditLog).where(eq(schema.auditLog.caseId, doomed.case!.id));
    await db.delete(schema.cases).where(eq(schema.cases.id, doomed.case!.id));
    const oldOrphan = stray(uploadDir, 'zz/orphan-old.jpg', hoursAgo(2));
    const newOrphan = stray(uploadDir, 'zz/orphan-new.jpg', null);
    const oldTemp = stray(uploadDir, '.incoming/old-upload.part', hoursAgo(2));
    const newTemp = stray(uploadDir, '.incoming/new-upload.part', null);

    const report = await runSweepJob(60);

    const removed = [...report.removedTemporary, ...report.removedUnreferenced].map((r) => r.key);
    expect(removed).toEqual(expect.arrayContaining(['zz/orphan-old.jpg', '.incoming/old-upload.part', goneRow!.storageKey, goneRow!.thumbKey!]));
    expect(removed).not.toContain('zz/orphan-new.jpg');
    expect(removed).not.toContain(keptRow!.storageKey);
    expect(existsSync(oldOrphan) || existsSync(oldTemp) || existsSync(join(uploadDir, goneRow!.storageKey))).toBe(false);
    expect(existsSync(newOrphan) && existsSync(newTemp)).toBe(true);
    expect(existsSync(join(uploadDir, keptRow!.storageKey)) && existsSync(join(uploadDir, keptRow!.thumbKey!))).toBe(true);
    // The kept upload still downloads.
    expect((await keeper.client.fetch(`/api/uploads/${kept.body.id}`)).status).toBe(200);
    rmSync(newOrphan);
    rmSync(newTemp);
  }, 60_000);
});

describe('the app killed in the middle of uploads', () => {
  it('leaves no row without its file, and the sweep leaves no file without its row', async () => {
    const c = await newCustomer({});
    const dir = mkdtempSync(join(tmpdir(), 'groundwork-kill-'));
    const port = await new Promise<number>((r) => {
      const s = net.createServer().listen(0, '127.0.0.1', () => {
        const { port } = s.address() as net.AddressInfo;
        s.close(() => r(port));
      });
    });
    const url = `http://127.0.0.1:${port}`;
    const app = spawn('node', [process.env.APP_ENTRY!], { env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', UPLOAD_DIR: dir }, stdio: 'ignore' });
    try {
      for (let i = 0; i < 100; i++) {
        if (await fetch(`${url}/api/health`).then((r) => r.ok, () => false)) break;
        await sleep(100);
      }
      const photo = await noisyJpeg(1600, 1200);
      const cookie = c.client.cookieHeader();
      // Staggered, so the kill lands on uploads at every stage: arriving, re-encoding, storing, committing.
      const answers = Array.from({ length: 8 }, (_, i) =>
        sleep(i * 120).then(() =>
          fetch(`${url}/api/cases/${c.case!.id}/uploads`, { method: 'POST', headers: { cookie, origin: url }, body: photoForm(photo) }).then(
            (r) => r.status,
            () => 0,
          ),
        ),
      );
      await sleep(700);
      const exited = new Promise((done) => app.once('exit', done));
      app.kill('SIGKILL');
      // Gone for certain (a thread busy in a disk write finishes that write before the process dies).
      await exited;
      const statuses = await Promise.all(answers);
      expect(statuses.filter((s) => s === 0).length, 'some uploads were cut off by the kill').toBeGreaterThan(0);

      // A COMMIT the app sent just before it died still completes in PostgreSQL a moment later,
      // so let the dead process's sessions finish before reading what was stored.
      await sleep(500);
      const rows = await db.select().from(schema.uploads).where(eq(schema.uploads.caseId, c.case!.id));
      // A 201 is a committed row; a cut-off request may have committed just before the kill too.
      expect(rows.length).toBeGreaterThanOrEqual(statuses.filter((s) => s === 201).length);
      for (const row of rows) {
        expect(existsSync(join(dir, row.storageKey)), `file of row ${row.id}`).toBe(true);
        if (row.thumbKey) expect(existsSync(join(dir, row.thumbKey)), `thumbnail of row ${row.id}`).toBe(true);
      }
      // Whatever is left over is removed by the sweep (grace 0 here: the app is dead, nothing is in flight).
      await sweepStorage({ storage: new LocalDiskStorage(dir), scratch: join(dir, '.incoming'), graceMinutes: 0, now: new Date(Date.now() + 1000) });
      // Read again: a row whose COMMIT landed late must still have its files, and keeps them.
      const after = await db.select().from(schema.uploads).where(eq(schema.uploads.caseId, c.case!.id));
      for (const row of after) {
        expect(existsSync(join(dir, row.storageKey)), `file of row ${row.id}`).toBe(true);
        if (row.thumbKey) expect(existsSync(join(dir, row.thumbKey)), `thumbnail of row ${row.id}`).toBe(true);
      }
      // listFiles gives "key size"; compare the keys.
      const referenced = new Set(after.flatMap((r) => [r.storageKey, r.thumbKey]).filter(Boolean));
      expect(listFiles(dir).filter((f) => !referenced.has(f.split(' ')[0]!))).toEqual([]);
    } finally {
      if (app.exitCode === null) app.kill('SIGKILL');
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
