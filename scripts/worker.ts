// The background worker: automatic reminders and the storage sweep on the PostgreSQL job queue. Started by
// `npm start` (and `npm test`) next to the app; stops cleanly on SIGINT/SIGTERM.
import { startReminderWorker } from '../src/lib/server/reminders.server';
import { startStorageSweep } from '../src/lib/server/storage-sweep.server';

const boss = await startReminderWorker();
await startStorageSweep(boss);
console.log('[groundwork] Reminder worker and storage sweep running.');
const stop = async () => {
  await boss.stop({ graceful: true, timeout: 5000 });
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
