// The background worker: automatic reminders on the PostgreSQL job queue. Started by
// `npm start` (and `npm test`) next to the app; stops cleanly on SIGINT/SIGTERM.
import { startReminderWorker } from '../src/lib/server/reminders.server';

const boss = await startReminderWorker();
console.log('[groundwork] Reminder worker running.');
const stop = async () => {
  await boss.stop({ graceful: true, timeout: 5000 });
  process.exit(0);
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
