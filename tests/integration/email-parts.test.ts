// Customer e-mails as they really go out (nodemailer over SMTP into the fake inbox): an HTML part
// and a plain-text part with the same words, a quoted rejection reason that ends once, the
// safety cautions, and the fake inbox's message page showing both parts. The stored copy still
// keeps no sign-in link.
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { messagesTo, waitForMessage, type Message } from '../helpers/mail';
import { newStaff } from '../helpers/people';
import { smallImage } from '../fixtures/uploads';
import { REDACTED_LINK } from '@/lib/server/case-mail.server';
import { customerPhotoCautions } from '@/lib/cautions';

const decode = (s: string) => s.replace(/&(amp|lt|gt|quot|#39);/g, (_, e: string) => ({ amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" })[e]!);
const htmlText = (html: string) => decode(html.replace(/<head>[\s\S]*?<\/head>/i, '').replace(/<[^>]+>/g, ' '));
const words = (s: string) => s.replace(/https?:\/\/\S+/g, ' ').toLowerCase().match(/[\p{L}\p{N}’']+/gu) ?? [];

describe('customer e-mails as delivered', () => {
  it('carry the same words in both parts, end a quoted reason once, and show both in the inbox', async () => {
    const { client: admin } = await newStaff('admin');
    const email = `parts-${Date.now()}@example.org`;
    const invited = await admin.send('POST', '/api/cases', { customer: { name: 'Nerys Tallow', email } });
    expect(invited.status).toBe(201);
    const caseId = invited.body.id as string;
    const customer = new Client();
    const inviteLink = (await waitForMessage(email, 1)).text.match(/https?:\/\/\S+token=\S+/)![0];
    expect((await customer.fetch(inviteLink)).status).toBe(302);

    const form = new FormData();
    form.set('kind', 'cutout_photo');
    form.set('file', new Blob([new Uint8Array(await smallImage('jpeg'))], { type: 'image/jpeg' }), 'cut-out.jpg');
    const up = await customer.json(`/api/cases/${caseId}/uploads`, { method: 'POST', body: form });
    expect(up.status).toBe(201);
    // The office's reason ends with its own full stop, as people type it.
    expect((await admin.send('POST', `/api/uploads/${up.body.id}/review`, { decision: 'rejected', reason: 'Too dark to read the rating.' })).status).toBe(200);
    expect((await admin.send('POST', `/api/cases/${caseId}/chase`, {})).status).toBe(200);

    await waitForMessage(email, 3);
    const [invitation, rejection, chase] = (await messagesTo(email)) as [Message, Message, Message];
    for (const m of [invitation, rejection, chase]) {
      expect(m.html, m.subject).toMatch(/^<!doctype html>/);
      expect(words(htmlText(m.html)), m.subject).toEqual(words(m.text));
      for (const caution of customerPhotoCautions) expect(m.text, m.subject).toContain(caution);
      expect(m.text).not.toMatch(/[.!?][”"’]?\./);
    }
    expect(rejection.text).toContain('Your installer said: “Too dark to read the rating.”');
    expect(chase.text).toContain('your installer said: “Too dark to read the rating.”');

    // The fake inbox's page for the chase shows the HTML part (sandboxed) and the plain-text part.
    const page = await (await fetch(`${process.env.MAIL_API_URL}/messages/${chase.id}`)).text();
    expect(page).toContain('<h2>HTML part</h2>');
    expect(page).toMatch(/<iframe title="HTML part of the message" sandbox="[^"]*" srcdoc="[^"]*Staying safe while you take photos/);
    expect(page).toContain('<h2>Plain-text part</h2>');
    expect(page).toContain('call 105');

    // The stored copy is the plain text with the link removed, never the live link.
    const [logged] = await db.select().from(schema.emailLog).where(eq(schema.emailLog.caseId, caseId)).then((rows) => rows.filter((r) => r.kind === 'chase'));
    expect(logged!.text).toContain(REDACTED_LINK);
    expect(logged!.text).not.toMatch(/token=/);
    expect(logged!.text).toContain('your installer said: “Too dark to read the rating.”');
  });
});
