// `npm run backup [-- PARENT_FOLDER]`: a consistent PostgreSQL dump and a copy of every stored
// file in a dated folder (default .data/backups/<date>). Reads the same variables as the app
// (DATABASE_URL, STORAGE_DRIVER, UPLOAD_DIR, S3_*); without DATABASE_URL it backs up the local
// database `npm start` runs, starting it for the time of the backup when it is stopped.
import { join } from 'node:path';
import { uploadStorage } from '@/lib/server/storage/index.server';
import { backup } from './lib/backup';
import { databaseForScript } from './lib/script-database';

const parent = process.argv[2] ?? join(process.cwd(), '.data', 'backups');
const db = await databaseForScript();
try {
  const folder = await backup({ databaseUrl: db.url, storage: uploadStorage(), parent });
  console.log(`[groundwork] Backup written to ${folder}`);
} finally {
  db.stop();
}
process.exit(0);
