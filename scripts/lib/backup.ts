// Backups that restore: a PostgreSQL dump in pg_dump's custom format plus a copy of every stored
// file, in one dated folder with a manifest; and the way back into an empty database and store.
import { execFile, execFileSync } from 'node:child_process';
import { promisify } from 'node:util';
import { createHash, randomUUID } from 'node:crypto';
import { createReadStream, createWriteStream, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { copyFile, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { pipeline } from 'node:stream/promises';
import postgres from 'postgres';
import type { Storage } from '@/lib/server/storage/storage';
import { findPgBin } from './postgres.mjs';

export type Manifest = {
  format: 'groundwork-backup-1';
  createdAt: string;
  database: { file: string; rows: Record<string, number> };
  files: Array<{ key: string; size: number; sha256: string }>;
};

const DUMP = 'database.dump';
const FILES = 'files';

function pgTool(name: 'pg_dump' | 'pg_restore'): string {
  const bin = findPgBin() as string | null;
  if (!bin) throw new Error(`${name} not found: install PostgreSQL's client tools (apt-get install postgresql-client).`);
  return join(bin, name);
}

type Conn = postgres.Sql | postgres.TransactionSql;

/** Rows per table in the public schema: a quick check that a restore brought everything back. */
async function countRows(sql: Conn): Promise<Record<string, number>> {
  const tables = await sql<{ name: string }[]>`select tablename as name from pg_tables where schemaname = 'public' order by 1`;
  const counts: Record<string, number> = {};
  for (const { name } of tables) counts[name] = Number((await sql.unsafe(`select count(*)::int as n from "${name}"`))[0]!.n);
  return counts;
}

async function rowCounts(databaseUrl: string): Promise<Record<string, number>> {
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} });
  try {
    return await countRows(sql);
  } finally {
    await sql.end();
  }
}

/**
 * pg_dump and our row counts read one exported snapshot, so the manifest describes exactly the
 * dump even while the app keeps writing (PostgreSQL docs, pg_dump --snapshot).
 */
async function dumpWithCounts(databaseUrl: string, file: string): Promise<Record<string, number>> {
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} });
  try {
    return await sql.begin('isolation level repeatable read read only', async (tx) => {
      const [{ snapshot }] = await tx<{ snapshot: string }[]>`select pg_export_snapshot() as snapshot`;
      await promisify(execFile)(pgTool('pg_dump'), ['--format=custom', '--no-owner', '--no-acl', `--snapshot=${snapshot}`, `--file=${file}`, `--dbname=${databaseUrl}`]);
      return countRows(tx);
    });
  } finally {
    await sql.end();
  }
}

/** The folder name for a backup taken now: 2026-12-03T081500Z. */
export const datedName = (now = new Date()) => now.toISOString().replace(/[-:]/g, (c) => (c === ':' ? '' : '-')).replace(/\.\d+Z$/, 'Z');

/**
 * Writes `<parent>/<date>/` with database.dump (pg_dump -Fc: one consistent snapshot), files/
 * (every stored object, by key) and manifest.json (row counts, each file's size and SHA-256).
 * The dump is taken first: a row it holds was committed with its file already in the store or
 * on its way, so the copy that follows finds it.
 * @example const folder = await backup({ databaseUrl, storage, parent: '.data/backups' });
 */
export async function backup({ databaseUrl, storage, parent }: { databaseUrl: string; storage: Storage; parent: string }): Promise<string> {
  const folder = join(parent, datedName());
  if (existsSync(folder)) throw new Error(`${folder} already exists.`);
  mkdirSync(join(folder, FILES), { recursive: true });
  const rows = await dumpWithCounts(databaseUrl, join(folder, DUMP));
  const files: Manifest['files'] = [];
  for await (const object of storage.list()) {
    const stored = await storage.get(object.key);
    if (!stored) continue; // deleted since it was listed
    const target = join(folder, FILES, object.key);
    mkdirSync(dirname(target), { recursive: true });
    const hash = createHash('sha256');
    stored.stream.on('data', (chunk: Buffer) => hash.update(chunk));
    await pipeline(stored.stream, createWriteStream(target, { flags: 'wx' }));
    files.push({ key: object.key, size: stored.size, sha256: hash.digest('hex') });
  }
  files.sort((a, b) => a.key.localeCompare(b.key));
  const manifest: Manifest = { format: 'groundwork-backup-1', createdAt: new Date().toISOString(), database: { file: DUMP, rows }, files };
  writeFileSync(join(folder, 'manifest.json'), JSON.stringify(manifest, null, 2) + '\n');
  return folder;
}

/** Creates the database named in the URL when it does not exist yet. */
async function ensureDatabase(databaseUrl: string): Promise<void> {
  const url = new URL(databaseUrl);
  const name = decodeURIComponent(url.pathname.slice(1));
  url.pathname = '/postgres';
  const admin = postgres(url.toString(), { max: 1, onnotice: () => {} });
  try {
    const found = await admin`select 1 from pg_database where datname = ${name}`;
    if (found.length === 0) await admin.unsafe(`create database "${name.replace(/"/g, '""')}"`);
  } finally {
    await admin.end();
  }
}

async function databaseIsEmpty(databaseUrl: string): Promise<boolean> {
  const sql = postgres(databaseUrl, { max: 1, onnotice: () => {} });
  try {
    const [row] = await sql`select count(*)::int as n from pg_tables where schemaname not in ('pg_catalog', 'information_schema')`;
    return row!.n === 0;
  } finally {
    await sql.end();
  }
}

async function storeIsEmpty(storage: Storage): Promise<boolean> {
  for await (const _ of storage.list()) return false;
  return true;
}

async function sha256Of(path: string): Promise<string> {
  const hash = createHash('sha256');
  await pipeline(createReadStream(path), hash);
  return hash.digest('hex');
}

/**
 * Restores a backup folder into an empty database (created when missing) and an empty store.
 * Refuses, changing nothing, when either already holds data; checks every file against the
 * manifest before storing it, and the row counts after.
 * @example await restore({ folder: '.data/backups/2026-12-03T081500Z', databaseUrl, storage });
 */
export async function restore({ folder, databaseUrl, storage }: { folder: string; databaseUrl: string; storage: Storage }): Promise<Manifest> {
  const manifest = JSON.parse(readFileSync(join(folder, 'manifest.json'), 'utf8')) as Manifest;
  if (manifest.format !== 'groundwork-backup-1') throw new Error(`${folder} is not a Groundwork backup.`);
  await ensureDatabase(databaseUrl);
  if (!(await databaseIsEmpty(databaseUrl))) throw new Error('The target database is not empty: restore into a new, empty database.');
  if (!(await storeIsEmpty(storage))) throw new Error('The target file store is not empty: restore into a new, empty bucket or folder.');
  // Every file is checked against the manifest before anything is written, so a damaged backup changes nothing.
  const scratch = await mkdtemp(join(tmpdir(), 'groundwork-restore-'));
  try {
    for (const f of manifest.files) {
      if ((await sha256Of(join(folder, FILES, f.key))) !== f.sha256) throw new Error(`${f.key} in the backup does not match its checksum: the backup is damaged.`);
    }
    for (const f of manifest.files) {
      // put() consumes the file it is given: hand it a copy, never the backup itself.
      const copy = join(scratch, randomUUID());
      await copyFile(join(folder, FILES, f.key), copy);
      await storage.put(f.key, { file: copy });
    }
  } finally {
    await rm(scratch, { recursive: true, force: true });
  }
  execFileSync(pgTool('pg_restore'), ['--no-owner', '--no-acl', '--exit-on-error', '--single-transaction', `--dbname=${databaseUrl}`, join(folder, manifest.database.file)], {
    stdio: 'inherit',
  });
  const rows = await rowCounts(databaseUrl);
  for (const [table, n] of Object.entries(manifest.database.rows)) {
    if (rows[table] !== n) throw new Error(`After the restore ${table} has ${rows[table] ?? 0} rows; the backup had ${n}.`);
  }
  return manifest;
}
