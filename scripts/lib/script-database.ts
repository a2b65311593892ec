// The database a maintenance script works on: DATABASE_URL, or else the local cluster that
// `npm start` runs (started for the script's time when it is stopped, and stopped again after).
import { join } from 'node:path';
import { localSecret, root, startDatabase } from './stack.mjs';

export async function databaseForScript(): Promise<{ url: string; stop: () => void }> {
  if (process.env.DATABASE_URL) return { url: process.env.DATABASE_URL, stop: () => {} };
  const db = await startDatabase({
    dataDir: join(root, '.data', 'pg'),
    fallbackName: 'groundwork-pg-data',
    port: Number(process.env.PGPORT ?? 54329),
    database: 'groundwork',
    password: localSecret('pg-password'),
    durable: true,
  });
  // config.server.ts reads DATABASE_URL; the storage driver does not need it, but keep one truth.
  process.env.DATABASE_URL = db.url;
  return db;
}
