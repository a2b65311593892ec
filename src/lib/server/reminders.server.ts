// Server-only: automatic reminders on a PostgreSQL-backed job queue (pg-boss). A sweep finds the
// cases due a reminder and queues one job per (case, reminder number); the job sends through
// sendCaseMail with the same key, so a retried or restarted job can never send twice.
import PgBoss from 'pg-boss';
import { and, eq, inArray, lt, or, isNull, sql } from 'drizzle-orm';
import { cases } from '../../db/schema';
import { chaseCase } from './chase.server';
import { config } from './config.server';
import { db } from './db.server';
import { hourInGb, reminderSettings } from './settings.server';
import { withinSendingHours } from '../text-rules';

export const SWEEP_QUEUE = 'reminders-sweep';
export const SEND_QUEUE = 'reminders-send';

export { hourInGb } from './settings.server';

/** The cases due a reminder now, with the number their next reminder will carry. */
export async function casesDueReminder(now = new Date()): Promise<{ caseId: string; n: number }[]> {
  const s = await reminderSettings();
  if (!s.enabled || s.maxReminders === 0) return [];
  const hour = hourInGb(now);
  if (!withinSendingHours(hour, s.sendFromHour, s.sendUntilHour)) return [];
  const dueBefore = new Date(now.getTime() - s.everyDays * 86_400_000);
  const rows = await db()
    .select({ id: cases.id, sent: cases.remindersSent })
    .from(cases)
    .where(
      and(
        inArray(cases.stage, ['invited', 'filling_in']),
        lt(cases.remindersSent, s.maxReminders),
        lt(cases.invitedAt, dueBefore),
        or(isNull(cases.lastChasedAt), lt(cases.lastChasedAt, dueBefore)),
        or(isNull(cases.lastCustomerActivityAt), lt(cases.lastCustomerActivityAt, dueBefore)),
        sql`${cases.readinessGaps} > 0`,
      ),
    )
    .limit(1000);
  return rows.map((r) => ({ caseId: r.id, n: r.sent + 1 }));
}

/** Sends reminder number n for a case, at most once however often it is called. */
export async function sendReminder(caseId: string, n: number, now = new Date()) {
  const [row] = await db().select().from(cases).where(eq(cases.id, caseId));
  if (!row || row.remindersSent >= n) return { sent: false, reason: 'Already sent.' };
  return chaseCase(row, { actorId: null, reminder: true, dedupeKey: `reminder:${caseId}:${n}`, now });
}

/**
 * Starts the queue: a sweep on a schedule (every 15 minutes by default) and the send worker.
 * @example const boss = await startReminderWorker(); … await boss.stop();
 */
export async function startReminderWorker({ cron = process.env.REMINDER_SWEEP_CRON ?? '*/15 * * * *' } = {}) {
  const boss = new PgBoss({ connectionString: config.databaseUrl, schema: 'pgboss', max: 3 });
  boss.on('error', (err) => console.error('[reminders]', err));
  await boss.start();
  await boss.createQueue(SWEEP_QUEUE);
  await boss.createQueue(SEND_QUEUE, { name: SEND_QUEUE, retryLimit: 3, retryDelay: 60 });
  await boss.schedule(SWEEP_QUEUE, cron, {}, { tz: 'Europe/London' });
  await boss.work(SWEEP_QUEUE, async () => {
    for (const due of await casesDueReminder()) {
      // One job per case and reminder number: queuing the same slot twice is a no-op.
      await boss.send(SEND_QUEUE, due, { singletonKey: `${due.caseId}:${due.n}` });
    }
  });
  await boss.work<{ caseId: string; n: number }>(SEND_QUEUE, async ([job]) => {
    await sendReminder(job!.data.caseId, job!.data.n);
  });
  return boss;
}
