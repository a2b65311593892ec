// `npm run restore -- FOLDER`: puts a backup back into an EMPTY database (created when missing)
// and an EMPTY file store, chosen by the same variables as the app (DATABASE_URL,
// STORAGE_DRIVER, UPLOAD_DIR, S3_*). It refuses, changing nothing, when either holds data.
import { resolve } from 'node:path';
import { uploadStorage } from '@/lib/server/storage/index.server';
import { restore } from './lib/backup';
import { databaseForScript } from './lib/script-database';

const folder = process.argv[2];
if (!folder) {
  console.error('Usage: npm run restore -- FOLDER   (a folder written by `npm run backup`)');
  process.exit(2);
}
const db = await databaseForScript();
try {
  const manifest = await restore({ folder: resolve(folder), databaseUrl: db.url, storage: uploadStorage() });
  const rows = Object.values(manifest.database.rows).reduce((a, b) => a + b, 0);
  console.log(`[groundwork] Restored ${rows} rows and ${manifest.files.length} files from ${folder} (backup of ${manifest.createdAt}).`);
} catch (err) {
  console.error(`[groundwork] Restore refused or failed: ${err instanceof Error ? err.message : err}`);
  process.exitCode = 1;
} finally {
  db.stop();
}
process.exit(process.exitCode ?? 0);
