// No working sign-in token is ever kept or handed out: every kind of case e-mail is sent once
// through the real API, then the stored e-mail log, the audit trail and what the office and the
// assigned surveyor can read are searched for every token the inbox received.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client, baseUrl } from '../helpers/http';
import { db, schema, sql } from '../helpers/db';
import { messagesTo, waitForMessage, type Message } from '../helpers/mail';
import { newStaff } from '../helpers/people';
import { smallImage } from '../fixtures/uploads';
import { sendReminder } from '@/lib/server/reminders.server';
import { REDACTED_LINK } from '@/lib/server/case-mail.server';

/** Every query-string value long enough to be a secret, from every link in a message. */
function secretsIn(message: Message): string[] {
  const urls = `${message.text}\n${message.html}`.match(/https?:\/\/[^\s"'<>]+/g) ?? [];
  return urls.flatMap((u) => [...new URL(u.replace(/&amp;/g, '&')).searchParams.values()].filter((v) => /^[0-9a-f]{32,}$/i.test(v)));
}

// Every CaseMailKind (src/lib/server/case-mail.server.ts).
const kinds = ['invitation', 'chase', 'reminder', 'rejection', 'submitted', 'changed_since_ready', 'survey_booked', 'outcome'];

describe('case e-mails keep no working sign-in link', () => {
  it('sends every kind, yet nothing stored, audited or returned to staff carries a token', async () => {
    const { client: admin } = await newStaff('admin');
    const { client: surveyor, user: surveyorUser } = await newStaff('surveyor');
    const email = `secrets-${Date.now()}@example.org`;

    // invitation (admin) — the customer signs in with its link, as a real customer would.
    const invited = await admin.send('POST', '/api/cases', { customer: { name: 'Ffion Quarry', email } });
    expect(invited.status).toBe(201);
    const caseId = invited.body.id as string;
    const customer = new Client();
    const inviteLink = (await waitForMessage(email, 1)).text.match(/https?:\/\/\S+token=\S+/)![0];
    expect((await customer.fetch(inviteLink)).status).toBe(302);
    expect((await customer.json('/api/me')).body.email).toBe(email);

    // rejection (admin rejects the customer's photo)
    const form = new FormData();
    form.set('kind', 'meter_photo');
    form.set('file', new Blob([new Uint8Array(await smallImage('jpeg'))], { type: 'image/jpeg' }), 'meter.jpg');
    const up = await customer.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body: form });
    expect(up.status).toBe(201);
    expect((await admin.send('POST', `/api/uploads/${up.body.id}/review`, { decision: 'rejected', reason: 'The meter numbers are not readable.' })).status).toBe(200);
    // chase (admin) and reminder (the scheduled job's own function)
    expect((await admin.send('POST', `/api/cases/${caseId}/chase`, {})).status).toBe(200);
    expect((await sendReminder(caseId, 1)).sent).toBe(true);
    // submitted (customer → office), changed_since_ready (customer → office), survey_booked (admin → customer), outcome (surveyor → office)
    expect((await customer.send('POST', `/api/cases/${caseId}/submit`, { acknowledgeGaps: true })).status).toBe(200);
    for (const to of ['in_review', 'ready_for_survey']) {
      const r = await admin.send('POST', `/api/cases/${caseId}/stage`, { to, overrideReason: 'Checked by phone with the customer; survey anyway.' });
      expect(r.status).toBe(200);
    }
    // changed_since_ready (customer edits after sign-off → office)
    expect((await customer.send('PATCH', `/api/cases/${caseId}/checklist`, { about: { fullName: 'Ffion Quarry-Hale' } })).status).toBe(200);
    expect((await admin.send('POST', `/api/cases/${caseId}/stage`, { to: 'survey_booked', surveyorId: surveyorUser.id, surveyDate: '2099-03-01' })).status).toBe(200);
    const outcome = await surveyor.send('POST', `/api/cases/${caseId}/outcome`, { outcome: 'go_ahead', confirmedEarthing: 'pme', confirmedFuseAmps: 100 });
    expect(outcome.status).toBe(200);

    const logged = await db.select().from(schema.emailLog).where(eq(schema.emailLog.caseId, caseId));
    expect([...new Set(logged.map((l) => l.kind))].sort()).toEqual([...kinds].sort());

    // Every token that really went out by e-mail (4 customer messages carry one).
    await waitForMessage(email, 5);
    const sent = await messagesTo(email);
    const secrets = sent.flatMap(secretsIn);
    expect(secrets.length).toBeGreaterThanOrEqual(4);

    const audit = await db.select().from(schema.auditLog).where(eq(schema.auditLog.caseId, caseId));
    const asAdmin = await admin.json(`/api/cases/${caseId}/emails`);
    const asSurveyor = await surveyor.json(`/api/cases/${caseId}/emails`);
    expect(asAdmin.status).toBe(200);
    expect(asSurveyor.status).toBe(200);
    const messagesAsAdmin = await admin.json(`/api/cases/${caseId}/messages`);
    const messagesAsSurveyor = await surveyor.json(`/api/cases/${caseId}/messages`);
    expect(messagesAsSurveyor.status).toBe(200);
    for (const item of messagesAsSurveyor.body.items) expect(item).not.toHaveProperty('text');
    const readable = [asAdmin.body, asSurveyor.body, messagesAsAdmin.body, messagesAsSurveyor.body, logged, audit].map((x) => JSON.stringify(x));
    for (const text of readable) for (const secret of secrets) expect(text).not.toContain(secret);

    // The office still reads what was said, with the link marked as removed; the surveyor only what was sent when.
    const rejection = asAdmin.body.items.find((i: { kind: string }) => i.kind === 'rejection');
    expect(rejection.text).toContain('The meter numbers are not readable.');
    expect(rejection.text).toContain(REDACTED_LINK);
    for (const item of asSurveyor.body.items) expect(Object.keys(item).sort()).toEqual(['createdAt', 'id', 'kind', 'subject']);

    // And no link a member of staff can see signs anyone in.
    const seenLinks = readable.join('\n').match(/https?:\/\/[^\s"'<>\\]+/g) ?? [];
    for (const link of seenLinks.filter((l) => l.startsWith(baseUrl))) {
      const thief = new Client();
      await thief.fetch(link);
      expect((await thief.json('/api/me')).status).toBe(401);
    }
  });
});

describe('e-mails stored before redaction', () => {
  it('are scrubbed by the migration that introduced it', async () => {
    const live = `${baseUrl}/api/auth/callback/nodemailer?callbackUrl=%2Fmy&token=${'ab'.repeat(32)}&email=old%40example.org`;
    const [row] = await db
      .insert(schema.emailLog)
      .values({ caseId: null, kind: 'chase', toEmail: 'old@example.org', subject: 'Old chase', text: `Carry on: ${live}\n\nOpen the case: ${baseUrl}/office/cases/1` })
      .returning();
    // The migration's own SQL, run again (it is idempotent): what a database upgraded with old rows gets.
    await sql.unsafe(readFileSync(join(process.cwd(), 'drizzle', '0008_redact-stored-links.sql'), 'utf8'));
    const [after] = await db.select().from(schema.emailLog).where(eq(schema.emailLog.id, row!.id));
    expect(after!.text).not.toContain('ab'.repeat(32));
    expect(after!.text).toContain(REDACTED_LINK);
    // A link without a secret is left as it was.
    expect(after!.text).toContain(`${baseUrl}/office/cases/1`);
  });
});
