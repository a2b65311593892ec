// `npm run backup` and `npm run restore` as an operator runs them: the demo database and its
// uploads (local disk) go into a dated folder, then come back into a fresh, empty database and
// an empty S3 bucket — and every row, answer, upload checksum and audit entry must match.
import { execFile } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync, cpSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import postgres from 'postgres';
import { CreateBucketCommand, S3Client } from '@aws-sdk/client-s3';
import { sql as original } from '../helpers/db';
import { LocalDiskStorage } from '@/lib/server/storage/local-disk.server';
import { S3Storage } from '@/lib/server/storage/s3.server';

const run = promisify(execFile);
const tsx = join(process.cwd(), 'node_modules', '.bin', 'tsx');
const scratch = mkdtempSync(join(tmpdir(), 'groundwork-backup-'));
const suffix = randomUUID().slice(0, 8);
const targets: { db: string; bucket: string }[] = [];

const s3 = {
  endpoint: process.env.S3_ENDPOINT!,
  region: process.env.S3_REGION ?? 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID!, secretAccessKey: process.env.S3_SECRET_ACCESS_KEY! },
};

/** A fresh Groundwork to restore into: a database name nobody uses yet and a new, empty bucket. */
async function freshTarget(name: string) {
  const db = `restored_${name}_${suffix}`;
  const bucket = `restored-${name}-${suffix}`;
  const client = new S3Client(s3);
  await client.send(new CreateBucketCommand({ Bucket: bucket }));
  client.destroy();
  targets.push({ db, bucket });
  const url = new URL(process.env.DATABASE_URL!);
  url.pathname = `/${db}`;
  return { url: url.toString(), bucket };
}

async function restoreInto(folder: string, target: { url: string; bucket: string }) {
  const env = { ...process.env, DATABASE_URL: target.url, STORAGE_DRIVER: 's3', S3_BUCKET: target.bucket, S3_FORCE_PATH_STYLE: 'true' };
  return run(tsx, ['scripts/restore.ts', folder], { env }).then(
    (r) => ({ code: 0, out: r.stdout + r.stderr }),
    (err: { code: number; stdout: string; stderr: string }) => ({ code: err.code, out: err.stdout + err.stderr }),
  );
}

// Every table the app owns, and a stable order for comparing them row by row.
const tables = async (sql: postgres.Sql) => (await sql<{ name: string }[]>`select tablename as name from pg_tables where schemaname = 'public' order by 1`).map((t) => t.name);
// to_jsonb in the database, so both sides compare PostgreSQL's own text of every value (microseconds and all).
const rowsOf = async (sql: postgres.Sql, table: string) =>
  (await sql.unsafe(`select to_jsonb(t)::text as row from "${table}" t order by 1`)).map((r) => r.row as string);

let folder: string;
let restored: postgres.Sql;
let target: { url: string; bucket: string };

beforeAll(async () => {
  const out = await run(tsx, ['scripts/backup.ts', join(scratch, 'backups')], { env: process.env });
  expect(out.stdout).toContain('Backup written to');
  const [name] = readdirSync(join(scratch, 'backups'));
  folder = join(scratch, 'backups', name!);
  target = await freshTarget('demo');
  const r = await restoreInto(folder, target);
  expect(r.out).toContain('Restored');
  expect(r.code).toBe(0);
  restored = postgres(target.url, { max: 2, onnotice: () => {} });
}, 120_000);

afterAll(async () => {
  await restored?.end();
  for (const t of targets) await original.unsafe(`drop database if exists "${t.db}" with (force)`);
  rmSync(scratch, { recursive: true, force: true });
});

describe('backup and restore', () => {
  it('writes a dated folder: a pg_dump custom-format file, the stored files and a manifest', () => {
    expect(folder).toMatch(/\d{4}-\d{2}-\d{2}T\d{6}Z$/);
    // pg_dump's custom format starts with the magic "PGDMP" (PostgreSQL source, pg_backup_archiver.c).
    expect(readFileSync(join(folder, 'database.dump')).subarray(0, 5).toString()).toBe('PGDMP');
    const manifest = JSON.parse(readFileSync(join(folder, 'manifest.json'), 'utf8'));
    expect(manifest.files.length).toBeGreaterThan(0);
    for (const f of manifest.files) {
      expect(createHash('sha256').update(readFileSync(join(folder, 'files', f.key))).digest('hex')).toBe(f.sha256);
    }
  });

  it('brings back the demo: every table, row for row — cases with their answers, uploads, audit entries', async () => {
    const names = await tables(original);
    expect(await tables(restored)).toEqual(names);
    for (const t of ['cases', 'uploads', 'audit_log', 'users']) expect(names).toContain(t);
    for (const t of names) {
      const [a, b] = [await rowsOf(original, t), await rowsOf(restored, t)];
      expect({ table: t, rows: b }).toEqual({ table: t, rows: a });
    }
    // The demo itself is there: the demo customer's case and its checklist answers.
    const [demo] = await restored`select c.checklist from cases c join users u on u.id = c.customer_id where u.email = 'customer@example.com'`;
    expect(demo?.checklist).toBeTruthy();
    const [orig] = await original`select c.checklist from cases c join users u on u.id = c.customer_id where u.email = 'customer@example.com'`;
    expect(demo!.checklist).toEqual(orig!.checklist);
  });

  it('every upload the database knows is in the new bucket with the checksum recorded when it arrived', async () => {
    const uploads = await original<{ storage_key: string; thumb_key: string | null; sha256: string; size_bytes: number; demo: boolean }[]>`
      select p.storage_key, p.thumb_key, p.sha256, p.size_bytes, u.email !~ '^customer-' as demo
      from uploads p join cases c on c.id = p.case_id join users u on u.id = c.customer_id`;
    // Other test files leave rows whose file was never stored (failure cases): only files that
    // were in the store can come back. Every demo upload (the seed's named customers, not the
    // factories' customer-… ones) must be among them.
    const source = new LocalDiskStorage(process.env.UPLOAD_DIR!);
    const stored = [];
    for (const u of uploads) if (await source.exists(u.storage_key)) stored.push(u);
    expect(uploads.filter((u) => u.demo).length).toBeGreaterThan(0);
    expect(stored.filter((u) => u.demo)).toEqual(uploads.filter((u) => u.demo));
    const bucket = new S3Storage({ ...s3, ...s3.credentials, bucket: target.bucket });
    for (const u of stored) {
      const got = await bucket.get(u.storage_key);
      expect(got, u.storage_key).not.toBeNull();
      const hash = createHash('sha256');
      for await (const chunk of got!.stream) hash.update(chunk);
      expect(hash.digest('hex')).toBe(u.sha256);
      expect(got!.size).toBe(u.size_bytes);
      if (u.thumb_key) expect(await bucket.exists(u.thumb_key)).toBe(true);
    }
    bucket.close();
  });

  it('refuses to restore over data, and changes nothing', async () => {
    const before = (await restored`select count(*)::int as n from audit_log`)[0]!.n;
    const r = await restoreInto(folder, target);
    expect(r.code).toBe(1);
    expect(r.out).toContain('not empty');
    expect((await restored`select count(*)::int as n from audit_log`)[0]!.n).toBe(before);
  });

  it('refuses a damaged backup before touching the database', async () => {
    const damaged = join(scratch, 'damaged');
    cpSync(folder, damaged, { recursive: true });
    const manifest = JSON.parse(readFileSync(join(damaged, 'manifest.json'), 'utf8'));
    writeFileSync(join(damaged, 'files', manifest.files[0].key), 'not the photo');
    const fresh = await freshTarget('damaged');
    const r = await restoreInto(damaged, fresh);
    expect(r.code).toBe(1);
    expect(r.out).toContain('checksum');
    const check = postgres(fresh.url, { max: 1, onnotice: () => {} });
    expect((await check`select count(*)::int as n from pg_tables where schemaname = 'public'`)[0]!.n).toBe(0);
    await check.end();
  });
});
