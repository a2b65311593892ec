import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { baseUrl, Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { newCustomer, newStaff } from '../helpers/people';
import { receiptFor, replyFrom, textsTo, uniqueMobile, until } from '../helpers/services';
import { sendReminder } from '@/lib/server/reminders.server';
import { chaseCase } from '@/lib/server/chase.server';
import { sendCaseText } from '@/lib/server/text-messages.server';
import { signParams } from '../../fake-services/sms-server.mjs';

// Against the fake SMS service (fake-services/sms-server.mjs), which speaks the provider's REST
// shape and signs webhooks as the provider specifies (docs/decisions/008-sms-provider.md).

// Noon and 02:00 in Great Britain (GMT in winter, BST in summer: both inside/outside 09–19).
const at = (hourUtc: number) => {
  const d = new Date();
  d.setUTCHours(hourUtc, 0, 0, 0);
  return d;
};

async function optedInCustomer() {
  const c = await newCustomer({ stage: 'invited', invitedDaysAgo: 5 });
  const mobile = uniqueMobile();
  const r = await c.client.send('PUT', `/api/cases/${c.case!.id}/texts`, { mobile: mobile.replace('+44', '0'), agree: true });
  expect(r.status).toBe(200);
  return { ...c, mobile };
}

const logFor = (caseId: string) => db.select().from(schema.textLog).where(eq(schema.textLog.caseId, caseId));

describe('text-message opt-in', () => {
  it('stores an explicit yes for a UK mobile with its time, and refuses a landline or a missing tick', async () => {
    const { client, case: c, user } = await newCustomer();
    const landline = await client.send('PUT', `/api/cases/${c!.id}/texts`, { mobile: '0113 496 0000', agree: true });
    expect(landline.status).toBe(422);
    expect(landline.body.error.fields.mobile).toMatch(/mobile/);
    const unticked = await client.send('PUT', `/api/cases/${c!.id}/texts`, { mobile: '07400 111222', agree: false });
    expect(unticked.status).toBe(422);
    expect(unticked.body.error.fields.agree).toBeTruthy();
    expect(await db.select().from(schema.textConsents).where(eq(schema.textConsents.userId, user.id))).toHaveLength(0);

    const before = Date.now();
    const ok = await client.send('PUT', `/api/cases/${c!.id}/texts`, { mobile: '07400 111222', agree: true });
    expect(ok.status).toBe(200);
    expect(ok.body).toMatchObject({ enabled: true, consented: true, mobile: '+447400111222' });
    const [row] = await db.select().from(schema.textConsents).where(eq(schema.textConsents.userId, user.id));
    expect(row!.consentedAt.getTime()).toBeGreaterThanOrEqual(before - 1000);
    const audit = await db.select().from(schema.auditLog).where(and(eq(schema.auditLog.caseId, c!.id), eq(schema.auditLog.action, 'texts.consented')));
    expect(audit).toHaveLength(1);
  });

  it('only the customer may agree, and only on their own case', async () => {
    const { client: admin } = await newStaff('admin');
    const { case: c } = await newCustomer();
    const { client: other } = await newCustomer();
    expect((await admin.send('PUT', `/api/cases/${c!.id}/texts`, { mobile: '07400 111333', agree: true })).status).toBe(403);
    expect((await other.send('PUT', `/api/cases/${c!.id}/texts`, { mobile: '07400 111333', agree: true })).status).toBe(404);
    expect((await new Client().send('PUT', `/api/cases/${c!.id}/texts`, { mobile: '07400 111333', agree: true })).status).toBe(401);
  });
});

describe('reminders by text', () => {
  it('texts an opted-in customer once per reminder, with a working sign-in link that the log never keeps', async () => {
    const { case: c, user, mobile } = await optedInCustomer();
    const result = await sendReminder(c!.id, 1, at(12));
    expect(result).toMatchObject({ sent: true, text: { sent: true } });
    const texts = await until(() => textsTo(mobile), (t) => t.length >= 1);
    expect(texts).toHaveLength(1);
    expect(texts[0]!.text).toContain('Reply STOP');
    const link = texts[0]!.text.match(/https?:\/\/\S+/)![0];
    expect(link.startsWith(baseUrl)).toBe(true);

    const [logged] = await logFor(c!.id);
    expect(logged!.text).toContain('[sign-in link]');
    expect(logged!.text).not.toContain('token=');
    expect(logged!.providerId).toBe(texts[0]!.id);

    // The same reminder again — a retried job — sends neither a second e-mail nor a second text.
    expect(await sendReminder(c!.id, 1, at(12))).toMatchObject({ sent: false });
    expect(await chaseCase(c!, { actorId: null, reminder: true, dedupeKey: `reminder:${c!.id}:1`, now: at(12) })).toMatchObject({ sent: false });
    await new Promise((r) => setTimeout(r, 300));
    expect(await textsTo(mobile)).toHaveLength(1);
    expect((await messagesTo(user.email)).filter((m) => m.subject.includes('reminder'))).toHaveLength(1);

    // The link in the text signs the customer in.
    const phone = new Client();
    const res = await phone.fetch(link);
    expect(res.status).toBe(302);
    expect(res.headers.get('location')).toBe(`${baseUrl}/my/cases/${c!.id}`);
  });

  it('a text under a used reminder key is never sent again, whatever the e-mail did', async () => {
    const { case: c, user, mobile } = await optedInCustomer();
    const text = { caseId: c!.id, userId: user.id, kind: 'reminder', mobile, text: 'Hello https://example.com/x?token=1', sentById: null, dedupeKey: `reminder:${c!.id}:9:text` };
    expect(await sendCaseText(text)).toBe(true);
    expect(await sendCaseText(text)).toBe(false);
    await new Promise((r) => setTimeout(r, 200));
    expect(await textsTo(mobile)).toHaveLength(1);
    expect((await logFor(c!.id)).map((r) => r.text)).toEqual(['Hello [sign-in link]']);
  });

  it('never texts someone who has not opted in; the e-mail still goes', async () => {
    const { case: c, user } = await newCustomer({ stage: 'invited', invitedDaysAgo: 5 });
    const result = await sendReminder(c!.id, 1, at(12));
    expect(result).toMatchObject({ sent: true, text: { sent: false, reason: 'The customer has not agreed to texts.' } });
    expect(await logFor(c!.id)).toHaveLength(0);
    expect(await messagesTo(user.email)).not.toHaveLength(0);
  });

  it('keeps quiet hours: a chase at 02:00 goes by e-mail only', async () => {
    const { case: c, mobile } = await optedInCustomer();
    const result = await chaseCase(c!, { actorId: null, now: at(2) });
    expect(result).toMatchObject({ sent: true, text: { sent: false, reason: expect.stringMatching(/only between 09:00 and 19:00/) } });
    expect(await textsTo(mobile)).toHaveLength(0);
  });
});

describe('delivery receipts', () => {
  it('the provider’s signed receipt updates the message history: delivered, then a later failure', async () => {
    const { case: c } = await optedInCustomer();
    await sendReminder(c!.id, 1, at(12));
    const delivered = await until(() => logFor(c!.id), (rows) => rows[0]?.status === 'delivered');
    expect(delivered[0]!.status).toBe('delivered');
    expect((await receiptFor(delivered[0]!.providerId!, 'failed', '6')).delivered).toBe(204);
    const [failed] = await logFor(c!.id);
    expect(failed).toMatchObject({ status: 'failed', statusDetail: 'error 6' });

    const { client: admin } = await newStaff('admin');
    const history = await admin.json(`/api/cases/${c!.id}/messages`);
    const channels = history.body.items.map((m: { channel: string; status: string }) => `${m.channel}:${m.status}`);
    expect(channels).toContain('text:failed');
    expect(channels).toContain('email:sent');
  });

  it('a receipt that beats our own update finds its text by client-ref, and keeps its status', async () => {
    const { case: c, user } = await optedInCustomer();
    const [row] = await db.insert(schema.textLog).values({ caseId: c!.id, userId: user.id, kind: 'chase', mobile: '+447400000001', text: 'x' }).returning();
    const params = { messageId: 'EARLY1', status: 'delivered', 'err-code': '0', 'client-ref': row!.id, msisdn: '447400000001', timestamp: String(Math.floor(Date.now() / 1000)), nonce: 'e1' };
    const r = await fetch(`${baseUrl}/api/sms/status`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ ...params, sig: signParams(params, 'fake-signature-secret', 'sha256') }) });
    expect(r.status).toBe(204);
    const [after] = await db.select().from(schema.textLog).where(eq(schema.textLog.id, row!.id));
    expect(after).toMatchObject({ providerId: 'EARLY1', status: 'delivered' });
  });

  it('refuses an unsigned, mis-signed or stale receipt and changes nothing', async () => {
    const { case: c } = await optedInCustomer();
    await sendReminder(c!.id, 1, at(12));
    const [row] = await until(() => logFor(c!.id), (rows) => rows[0]?.status === 'delivered');
    const params = { messageId: row!.providerId!, status: 'failed', 'err-code': '1', msisdn: '447400000000', timestamp: String(Math.floor(Date.now() / 1000)), nonce: 'abc' };
    const post = (body: unknown) => fetch(`${baseUrl}/api/sms/status`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
    expect((await post(params)).status).toBe(401);
    expect((await post({ ...params, sig: signParams(params, 'not-the-secret', 'sha256') })).status).toBe(401);
    const stale = { ...params, timestamp: String(Math.floor(Date.now() / 1000) - 3600) };
    expect((await post({ ...stale, sig: signParams(stale, 'fake-signature-secret', 'sha256') })).status).toBe(401);
    expect((await fetch(`${baseUrl}/api/sms/status`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{not json' })).status).toBe(400);
    expect((await logFor(c!.id))[0]!.status).toBe('delivered');
    // The same receipt signed with the right secret is taken: the check above was the signature.
    expect((await post({ ...params, sig: signParams(params, 'fake-signature-secret', 'sha256') })).status).toBe(204);
    expect((await logFor(c!.id))[0]!.status).toBe('failed');
  });
});

describe('STOP', () => {
  it('a signed STOP reply withdraws consent at once, is logged, and no text follows', async () => {
    const { case: c, user, mobile } = await optedInCustomer();
    await sendReminder(c!.id, 1, at(12));
    await until(() => textsTo(mobile), (t) => t.length >= 1);
    expect((await replyFrom(mobile, 'Stop')).delivered).toBe(204);

    const [consent] = await db.select().from(schema.textConsents).where(eq(schema.textConsents.userId, user.id));
    expect(consent!.withdrawnAt).not.toBeNull();
    expect(consent!.withdrawnVia).toBe('stop');
    const inbound = (await logFor(c!.id)).filter((r) => r.direction === 'inbound');
    expect(inbound).toMatchObject([{ kind: 'stop', text: 'Stop', status: 'received' }]);
    const audit = await db.select().from(schema.auditLog).where(and(eq(schema.auditLog.caseId, c!.id), eq(schema.auditLog.action, 'texts.withdrawn')));
    expect(audit).toHaveLength(1);

    await db.update(schema.cases).set({ lastChasedAt: null }).where(eq(schema.cases.id, c!.id));
    expect(await sendReminder(c!.id, 2, at(12))).toMatchObject({ sent: true, text: { sent: false, reason: 'The customer has stopped texts.' } });
    expect(await textsTo(mobile)).toHaveLength(1);
  });

  it('a forged STOP (bad signature) changes nothing', async () => {
    const { user, mobile } = await optedInCustomer();
    const params = { msisdn: mobile.slice(1), to: '447700900000', messageId: 'X1', text: 'STOP', type: 'text', timestamp: String(Math.floor(Date.now() / 1000)), nonce: 'n' };
    const r = await fetch(`${baseUrl}/api/sms/inbound`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ ...params, sig: signParams(params, 'guess', 'sha256') }) });
    expect(r.status).toBe(401);
    const [consent] = await db.select().from(schema.textConsents).where(eq(schema.textConsents.userId, user.id));
    expect(consent!.withdrawnAt).toBeNull();
  });
});
