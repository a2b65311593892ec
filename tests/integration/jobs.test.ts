// Background work with more than one worker: the queues in PostgreSQL, not any one process,
// decide that a sweep, a reminder and a readiness recompute happen once.
import { afterAll, describe, expect, it } from 'vitest';
import { eq, inArray } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import { db, reminderOnlyFor, schema, sql } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';
import { RECOMPUTE_QUEUE, SEND_QUEUE, SWEEP_QUEUE, ensureQueues, startWorkerBoss } from '@/lib/server/jobs.server';
import { sendReminder, sweepReminders } from '@/lib/server/reminders.server';

const noonGb = () => {
  const d = new Date();
  d.setUTCHours(12, 0, 0, 0);
  return d;
};

async function waitFor<T>(fn: () => Promise<T>, ok: (v: T) => boolean, ms = 20_000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (ok(v) || Date.now() > until) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
}

const bosses: PgBoss[] = [];
afterAll(async () => {
  for (const b of bosses) await b.stop({ graceful: false, wait: true }).catch(() => {});
});

describe('jobs with several workers', () => {
  it('every queue holds at most one waiting and one running job per key (pg-boss "stately")', async () => {
    const boss = await startWorkerBoss();
    bosses.push(boss);
    for (const name of [SWEEP_QUEUE, SEND_QUEUE, RECOMPUTE_QUEUE]) expect((await boss.getQueue(name))?.policy).toBe('stately');
    // A queue an older release created with pg-boss's default policy is brought up to date.
    await boss.updateQueue(SWEEP_QUEUE, { name: SWEEP_QUEUE, policy: 'standard' });
    expect((await boss.getQueue(SWEEP_QUEUE))?.policy).toBe('standard');
    await ensureQueues(boss);
    expect((await boss.getQueue(SWEEP_QUEUE))?.policy).toBe('stately');
  });

  it('two workers sweeping at the same moment send each due reminder once', async () => {
    // The test stack's own worker is a third: all three take jobs from the same queue.
    const [a, b] = [await startWorkerBoss(), await startWorkerBoss()];
    bosses.push(a, b);
    for (const boss of [a, b]) await boss.work<{ caseId: string; n: number }>(SEND_QUEUE, async ([job]) => void (await sendReminder(job!.data.caseId, job!.data.n)));
    const people = await Promise.all([1, 2, 3].map(() => createUser(db, { role: 'customer', name: 'Swept Customer' })));
    const rows = await Promise.all(people.map((p) => createCase(db, { customerId: p.id, stage: 'invited', invitedDaysAgo: 6 })));
    await reminderOnlyFor(rows.map((r) => r.id));
    const queued = await Promise.all([sweepReminders(a, noonGb()), sweepReminders(b, noonGb()), sweepReminders(a, noonGb())]);
    expect(queued.reduce((x, y) => x + y, 0)).toBeGreaterThanOrEqual(3);
    const ids = rows.map((r) => r.id);
    await waitFor(
      () => db.select().from(schema.cases).where(inArray(schema.cases.id, ids)),
      (list) => list.every((c) => c.remindersSent === 1),
    );
    // Give any duplicate job time to run (and fail to send) before counting.
    await new Promise((r) => setTimeout(r, 2500));
    for (const p of people) expect(await messagesTo(p.email)).toHaveLength(1);
    const log = await db.select().from(schema.emailLog).where(inArray(schema.emailLog.caseId, ids));
    expect(log.map((l) => l.kind)).toEqual(['reminder', 'reminder', 'reminder']);
  });

  it('a readiness setting change is answered at once and recomputed by a queued job', async () => {
    const { client: admin } = await newStaff('admin');
    const user = await createUser(db, { role: 'customer' });
    // 80 A fuse, no declared loads: 10 A baseline + 32 A charger = 42 A, headroom 38 A
    // (common practice — no published source; the same figures as office-actions.test.ts).
    const c = await createCase(db, {
      customerId: user.id,
      checklist: { supply: { mainFuseAmps: 80, loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false } } },
    });
    const lightOf = async () => {
      const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, c.id));
      return (row!.readinessChecks as { id: string; light: string }[]).find((x) => x.id === 'supply-headroom')?.light;
    };
    const since = new Date();
    const put = await admin.send('PUT', '/api/settings', { readiness: { headroomMarginAmps: 40 } });
    try {
      expect(put.status).toBe(200);
      expect(put.body.recomputeQueued).toBe(true);
      expect(await waitFor(lightOf, (l) => l === 'amber')).toBe('amber');
      const states = () => sql`select state from pgboss.job where name = ${RECOMPUTE_QUEUE} and created_on >= ${since.toISOString()}::timestamptz`;
      expect((await waitFor(states, (rows) => rows.some((j) => j.state === 'completed'))).map((j) => j.state)).toContain('completed');
    } finally {
      await admin.send('PUT', '/api/settings', { readiness: { headroomMarginAmps: 10 } });
      await waitFor(lightOf, (l) => l === 'green');
    }
  });
});
