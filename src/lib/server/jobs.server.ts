// Server-only: the PostgreSQL job queue (pg-boss) shared by every app node and worker. Queue
// policies, not process memory, make work run once however many processes are up.
import PgBoss from 'pg-boss';
import { config } from './config.server';

export const SWEEP_QUEUE = 'reminders-sweep';
export const SEND_QUEUE = 'reminders-send';
export const RECOMPUTE_QUEUE = 'readiness-recompute';
export const STORAGE_SWEEP_QUEUE = 'storage-sweep';

/**
 * "stately": at most one job per key waiting and one running. Two workers whose schedules fire
 * together queue one sweep; a reminder slot (case, number) is queued once; settings saved five
 * times in a row leave one recompute waiting behind the running one, and it reads the newest.
 */
const queues: Array<{ name: string; options: Omit<PgBoss.Queue, 'name'> }> = [
  { name: SWEEP_QUEUE, options: { policy: 'stately' } },
  { name: SEND_QUEUE, options: { policy: 'stately', retryLimit: 3, retryDelay: 60 } },
  { name: RECOMPUTE_QUEUE, options: { policy: 'stately', retryLimit: 3, retryDelay: 30 } },
  { name: STORAGE_SWEEP_QUEUE, options: { policy: 'stately' } },
];

/** Creates the queues, and sets the policy on queues an older release created without one. */
export async function ensureQueues(boss: PgBoss): Promise<void> {
  for (const q of queues) {
    const existing = await boss.getQueue(q.name);
    if (!existing) await boss.createQueue(q.name, { name: q.name, ...q.options });
    else if (existing.policy !== q.options.policy) await boss.updateQueue(q.name, { name: q.name, ...q.options });
  }
}

/** A pg-boss for a process that works jobs (the worker): maintenance and schedules on. */
export async function startWorkerBoss(): Promise<PgBoss> {
  const boss = new PgBoss({ connectionString: config.databaseUrl, schema: 'pgboss', max: 3 });
  boss.on('error', (err) => console.error('[jobs]', err));
  await boss.start();
  await ensureQueues(boss);
  return boss;
}

let sender: Promise<PgBoss> | undefined;

/** The app node's pg-boss: it only queues jobs, so no maintenance, no schedules, one connection pair. */
function jobSender(): Promise<PgBoss> {
  sender ??= (async () => {
    const boss = new PgBoss({ connectionString: config.databaseUrl, schema: 'pgboss', max: 2, supervise: false, schedule: false });
    boss.on('error', (err) => console.error('[jobs]', err));
    await boss.start();
    await ensureQueues(boss);
    return boss;
  })().catch((err) => {
    sender = undefined;
    throw err;
  });
  return sender;
}

/**
 * Queues a readiness recompute of every open case (after a settings change). Answers false when
 * one is already waiting: that one will read the settings as they are when it runs.
 * @example await queueReadinessRecompute() // true
 */
export async function queueReadinessRecompute(): Promise<boolean> {
  const boss = await jobSender();
  return (await boss.send(RECOMPUTE_QUEUE, {}, { singletonKey: 'all-open-cases' })) !== null;
}
