// The background worker: automatic reminders and the storage sweep on the PostgreSQL job queue. Started by
// `npm start` (and `npm test`) next to the app; stops cleanly on SIGINT/SIGTERM.
import { startReminderWorker } from '../src/lib/server/reminders.server';
import { startStorageSweep } from '../src/lib/server/storage-sweep.server';

// Started while PostgreSQL is down (or restarting), keep trying rather than exit: once running,
// pg-boss reconnects by itself, and starting should be no less patient.
async function start() {
  for (;;) {
    try {
      const boss = await startReminderWorker();
      await startStorageSweep(boss);
      return boss;
    } catch (err) {
      console.warn(`[groundwork] The worker could not start (${(err as Error).message}); trying again in 5 s.`);
      await new Promise((r) => setTimeout(r, 5000));
    }
  }
}

const boss = await start();
console.log('[groundwork] Reminder worker and storage sweep running.');
const stop = async () => {
  await boss.stop({ graceful: true, timeout: 5000 });
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
