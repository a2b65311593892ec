// Server-only: the sweep that removes what an interrupted upload or a deleted case left on disk.
// An upload moves its files into storage before its row commits, so a process killed in between
// leaves files no row refers to; a deleted case takes its upload rows with it (ON DELETE CASCADE)
// but not its files. Both are removed here once older than the grace period, which is far longer
// than any upload takes, so a file whose row is about to commit is never touched.
import { opendir, rm, stat } from 'node:fs/promises';
import { join } from 'node:path';
import { inArray, or } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import { uploads } from '@/db/schema';
import { db } from './db.server';
import { uploadStorage, type Storage } from './storage/index.server';
import { scratchDir } from './uploads.server';

import { STORAGE_SWEEP_QUEUE } from './jobs.server';

export { STORAGE_SWEEP_QUEUE };

/** An hour: a 15 MB photo at 1 Mbit/s takes about two minutes to arrive. */
export const DEFAULT_GRACE_MINUTES = Number(process.env.STORAGE_SWEEP_GRACE_MINUTES ?? 60);

type Removed = { key: string; size: number; modifiedAt: string };
export type SweepReport = { removedTemporary: Removed[]; removedUnreferenced: Removed[]; keptStored: number };

const BATCH = 500;

/**
 * Removes temporary upload files and stored files no upload row refers to, if older than the
 * grace period, and logs each one it removes.
 *
 * @example const report = await sweepStorage({ graceMinutes: 60 }); report.removedUnreferenced.length // 0
 */
export async function sweepStorage({
  storage = uploadStorage(),
  scratch = scratchDir(),
  graceMinutes = DEFAULT_GRACE_MINUTES,
  now = new Date(),
}: { storage?: Storage; scratch?: string; graceMinutes?: number; now?: Date } = {}): Promise<SweepReport> {
  const before = now.getTime() - graceMinutes * 60_000;
  const report: SweepReport = { removedTemporary: [], removedUnreferenced: [], keptStored: 0 };
  await sweepScratch(scratch, before, report);
  let batch: { key: string; size: number; modifiedAt: Date }[] = [];
  for await (const object of storage.list()) {
    batch.push(object);
    if (batch.length >= BATCH) {
      await sweepBatch(storage, batch, before, report);
      batch = [];
    }
  }
  if (batch.length) await sweepBatch(storage, batch, before, report);
  return report;
}

async function sweepScratch(dir: string, before: number, report: SweepReport) {
  let entries;
  try {
    entries = await opendir(dir);
  } catch {
    return; // no upload has arrived yet
  }
  for await (const entry of entries) {
    if (!entry.isFile()) continue;
    const path = join(dir, entry.name);
    const info = await stat(path).catch(() => null);
    if (!info || info.mtimeMs >= before) continue;
    await rm(path, { force: true });
    const removed = { key: `.incoming/${entry.name}`, size: info.size, modifiedAt: info.mtime.toISOString() };
    report.removedTemporary.push(removed);
    console.log(`[storage-sweep] removed temporary file ${removed.key} (${removed.size} bytes, last written ${removed.modifiedAt})`);
  }
}

async function sweepBatch(storage: Storage, batch: { key: string; size: number; modifiedAt: Date }[], before: number, report: SweepReport) {
  const keys = batch.map((o) => o.key);
  const rows = await db()
    .select({ storageKey: uploads.storageKey, thumbKey: uploads.thumbKey })
    .from(uploads)
    .where(or(inArray(uploads.storageKey, keys), inArray(uploads.thumbKey, keys)));
  const referenced = new Set(rows.flatMap((r) => [r.storageKey, r.thumbKey]).filter((k): k is string => Boolean(k)));
  for (const object of batch) {
    if (referenced.has(object.key) || object.modifiedAt.getTime() >= before) {
      report.keptStored++;
      continue;
    }
    await storage.delete(object.key);
    const removed = { key: object.key, size: object.size, modifiedAt: object.modifiedAt.toISOString() };
    report.removedUnreferenced.push(removed);
    console.log(`[storage-sweep] removed ${removed.key} (${removed.size} bytes, last written ${removed.modifiedAt}): no upload refers to it`);
  }
}

/**
 * Schedules the sweep on the worker's queue: hourly by default (`STORAGE_SWEEP_CRON`). A job may
 * carry `{ graceMinutes }`; its output is the report, kept by pg-boss with the job.
 */
export async function startStorageSweep(boss: PgBoss, { cron = process.env.STORAGE_SWEEP_CRON ?? '23 * * * *' } = {}) {
  await boss.schedule(STORAGE_SWEEP_QUEUE, cron, {}, { tz: 'Europe/London' });
  await boss.work<{ graceMinutes?: number }>(STORAGE_SWEEP_QUEUE, async ([job]) => {
    const grace = job?.data?.graceMinutes;
    return sweepStorage(typeof grace === 'number' && grace >= 0 ? { graceMinutes: grace } : {});
  });
}
