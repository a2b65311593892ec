// The background worker: automatic reminders, readiness recomputes and the storage sweep on the
// PostgreSQL job queue. Started by `npm start` (and `npm test`) next to the app; any number may
// run at once. Stops cleanly on SIGINT/SIGTERM.
import { startWorkerBoss } from '@/lib/server/jobs.server';
import { workReadinessRecompute } from '@/lib/server/readiness.server';
import { startReminderWorker } from '@/lib/server/reminders.server';
import { startStorageSweep } from '@/lib/server/storage-sweep.server';

// Started while PostgreSQL is down (or restarting), keep trying rather than exit: once running,
// pg-boss reconnects by itself, and starting should be no less patient.
async function start() {
  for (;;) {
    let boss: Awaited<ReturnType<typeof startWorkerBoss>> | undefined;
    try {
      boss = await startWorkerBoss();
      await startReminderWorker({ boss });
      await workReadinessRecompute(boss);
      await startStorageSweep(boss);
      return boss;
    } catch (err) {
      await boss?.stop({ graceful: false }).catch(() => {});
      console.warn(`[groundwork] The worker could not start (${(err as Error).message}); trying again in 5 s.`);
      await new Promise((r) => setTimeout(r, 5000));
    }
  }
}

const boss = await start();
console.log('[groundwork] Worker running: reminders, readiness recomputes, storage sweep.');
const stop = async () => {
  await boss.stop({ graceful: true, timeout: 5000 });
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
