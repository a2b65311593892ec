// Server-only: automatic reminders on a PostgreSQL-backed job queue (pg-boss). A sweep finds the
// cases due a reminder and queues one job per (case, reminder number); the job sends through
// sendCaseMail with the same key, so a retried or restarted job can never send twice.
import type PgBoss from 'pg-boss';
import { and, eq, inArray, lt, or, isNull, sql } from 'drizzle-orm';
import { cases } from '@/db/schema';
import { chaseCase } from './chase.server';
import { db } from './db.server';
import { SEND_QUEUE, SWEEP_QUEUE, startWorkerBoss } from './jobs.server';
import { hourInGb, reminderSettings } from './settings.server';
import { withinSendingHours } from '@/lib/text-rules';

export { SEND_QUEUE, SWEEP_QUEUE };

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

/** Queues one send job per due slot; a slot already queued or running is not queued again. */
export async function sweepReminders(boss: PgBoss, now = new Date()): Promise<number> {
  let queued = 0;
  for (const due of await casesDueReminder(now)) {
    if ((await boss.send(SEND_QUEUE, due, { singletonKey: `${due.caseId}:${due.n}` })) !== null) queued++;
  }
  return queued;
}

/**
 * Starts the queue: a sweep on a schedule (every 15 minutes by default) and the send worker.
 * However many workers run, pg-boss fires the schedule once per tick and the queues' stately
 * policy keeps one sweep and one job per reminder slot (see jobs.server.ts).
 * @example const boss = await startReminderWorker(); … await boss.stop();
 */
export async function startReminderWorker({ cron = process.env.REMINDER_SWEEP_CRON ?? '*/15 * * * *', boss: given }: { cron?: string; boss?: PgBoss } = {}) {
  const boss = given ?? (await startWorkerBoss());
  await boss.schedule(SWEEP_QUEUE, cron, {}, { tz: 'Europe/London', singletonKey: 'sweep' });
  await boss.work(SWEEP_QUEUE, async () => {
    await sweepReminders(boss);
  });
  await boss.work<{ caseId: string; n: number }>(SEND_QUEUE, async ([job]) => {
    await sendReminder(job!.data.caseId, job!.data.n);
  });
  return boss;
}
