import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { db, reminderOnlyFor, schema } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { createCase, createUser } from '../../seeds/factories';
import { casesDueReminder, hourInGb, sendReminder, startReminderWorker, SEND_QUEUE } from '@/lib/server/reminders.server';

// Noon in Great Britain today: inside the default 09:00–19:00 window whatever time the test runs.
const noonGb = () => {
  const d = new Date();
  d.setUTCHours(12, 0, 0, 0);
  return d;
};
const nightGb = () => {
  const d = new Date();
  d.setUTCHours(2, 0, 0, 0);
  return d;
};

async function invitedCustomer(daysAgo: number) {
  const user = await createUser(db, { role: 'customer', name: 'Reminder Person' });
  const row = await createCase(db, { customerId: user.id, stage: 'invited', invitedDaysAgo: daysAgo });
  return { user, row };
}

async function waitFor<T>(fn: () => Promise<T>, ok: (v: T) => boolean, ms = 15_000): Promise<T> {
  const until = Date.now() + ms;
  for (;;) {
    const v = await fn();
    if (ok(v) || Date.now() > until) return v;
    await new Promise((r) => setTimeout(r, 200));
  }
}

const bosses: { stop: (o?: object) => Promise<void> }[] = [];
afterAll(async () => {
  for (const b of bosses) await b.stop({ graceful: false, wait: true }).catch(() => {});
});

describe('automatic reminders', () => {
  it('finds a case invited more than "every N days" ago, but never at night', async () => {
    const { row } = await invitedCustomer(4);
    const { row: fresh } = await invitedCustomer(1);
    expect(hourInGb(noonGb())).toBeGreaterThanOrEqual(11);
    const due = await casesDueReminder(noonGb());
    expect(due).toContainEqual({ caseId: row.id, n: 1 });
    expect(due.map((d) => d.caseId)).not.toContain(fresh.id);
    expect((await casesDueReminder(nightGb())).map((d) => d.caseId)).not.toContain(row.id);
  });

  it('sends one reminder through the job queue, and not again after a restart or a repeated job', async () => {
    const { user, row } = await invitedCustomer(5);
    await reminderOnlyFor([row.id]);
    const first = await startReminderWorker();
    bosses.push(first);
    for (const due of await casesDueReminder(noonGb())) {
      if (due.caseId === row.id) await first.send(SEND_QUEUE, due, { singletonKey: `${due.caseId}:${due.n}` });
    }
    const sent = await waitFor(() => messagesTo(user.email), (m) => m.length >= 1);
    expect(sent).toHaveLength(1);
    expect(sent[0]!.subject).toContain('reminder');
    await waitFor(async () => (await db.select().from(schema.cases).where(eq(schema.cases.id, row.id)))[0]!.remindersSent, (n) => n === 1);
    await first.stop({ graceful: true, wait: true });

    // "Restart": a new worker, the same sweep, the same job queued again, the job run again by hand.
    const second = await startReminderWorker();
    bosses.push(second);
    expect((await casesDueReminder(noonGb())).map((d) => d.caseId)).not.toContain(row.id);
    await second.send(SEND_QUEUE, { caseId: row.id, n: 1 }, { singletonKey: `${row.id}:1` });
    expect(await sendReminder(row.id, 1)).toMatchObject({ sent: false });
    await new Promise((r) => setTimeout(r, 3000));
    expect(await messagesTo(user.email)).toHaveLength(1);
    const log = await db.select().from(schema.emailLog).where(eq(schema.emailLog.caseId, row.id));
    expect(log.map((l) => l.kind)).toEqual(['reminder']);
  });

  it('stops after the most reminders allowed', async () => {
    const { row } = await invitedCustomer(20);
    await db.update(schema.cases).set({ remindersSent: 3 }).where(eq(schema.cases.id, row.id));
    expect((await casesDueReminder(noonGb())).map((d) => d.caseId)).not.toContain(row.id);
  });
});
