// The background worker: automatic reminders and readiness recomputes on the PostgreSQL job
// queue. Started by `npm start` (and `npm test`) next to the app; any number may run at once.
// Stops cleanly on SIGINT/SIGTERM.
import { startWorkerBoss } from '../src/lib/server/jobs.server';
import { workReadinessRecompute } from '../src/lib/server/readiness.server';
import { startReminderWorker } from '../src/lib/server/reminders.server';

const boss = await startWorkerBoss();
await startReminderWorker({ boss });
await workReadinessRecompute(boss);
console.log('[groundwork] Worker running: reminders, readiness recomputes.');
const stop = async () => {
  await boss.stop({ graceful: true, timeout: 5000 });
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
