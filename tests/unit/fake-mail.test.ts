import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import nodemailer from 'nodemailer';
import type SMTPTransport from 'nodemailer/lib/smtp-transport';
import { startMailServer } from '../../fake-services/mail-server.mjs';

// The fake stands in for a hosted SMTP service, so the checks are against the protocols it
// speaks (RFC 5321 SMTP, RFC 5322 message format, RFC 4954 AUTH) and the HTML standard's
// rules for sandboxed iframes, plus the inbox API the integration tests rely on.

type ApiMessage = { id: string; to: string; from: string; subject: string; text: string; html: string; date: string };

let mail: Awaited<ReturnType<typeof startMailServer>>;
let api: string;

beforeAll(async () => {
  mail = await startMailServer({ smtpPort: 0, httpPort: 0, quiet: true });
  api = `http://127.0.0.1:${mail.httpPort}`;
});

afterAll(async () => {
  await mail?.close();
});

beforeEach(async () => {
  await fetch(`${api}/api/messages`, { method: 'DELETE' });
});

function transport(extra: SMTPTransport.Options = {}) {
  return nodemailer.createTransport({ host: '127.0.0.1', port: mail.smtpPort, secure: false, ignoreTLS: true, ...extra });
}

async function send(message: nodemailer.SendMailOptions, extra: SMTPTransport.Options = {}) {
  const t = transport(extra);
  try {
    return await t.sendMail({ from: 'Groundwork <no-reply@example.org>', ...message });
  } finally {
    t.close();
  }
}

async function listMessages(query = ''): Promise<ApiMessage[]> {
  const res = await fetch(`${api}/api/messages${query}`);
  expect(res.status).toBe(200);
  return (await res.json()) as ApiMessage[];
}

describe('fake mail server: SMTP in, JSON out', () => {
  it('returns the ports it actually bound when asked for port 0', () => {
    // Port 0 asks the OS for any free port (POSIX bind()); a real one is never 0.
    expect(mail.smtpPort).toBeGreaterThan(0);
    expect(mail.httpPort).toBeGreaterThan(0);
    expect(mail.smtpPort).not.toBe(mail.httpPort);
  });

  it('keeps a message with text and HTML parts and lists it with the agreed fields', async () => {
    const before = Date.now();
    const info = await send({
      to: ['Sam Carter <sam.carter@example.com>', 'office@example.org'],
      subject: 'Your charge point checklist',
      text: 'Hello Sam,\nPlease add a photo of your consumer unit.',
      html: '<p>Hello Sam,</p><p>Please add a photo of your <strong>consumer unit</strong>.</p>',
    });
    // RFC 5321 §4.2: a 250 reply to DATA means the server has taken the message.
    expect(info.response).toMatch(/^250/);
    expect(info.accepted).toEqual(['sam.carter@example.com', 'office@example.org']);

    const messages = await listMessages();
    expect(messages).toHaveLength(1);
    const [m] = messages;
    // RFC 5322 §3.6.3: To holds an address list; the API joins the bare addresses, display
    // names dropped: "sam.carter@example.com" + ", " + "office@example.org".
    expect(m.to).toBe('sam.carter@example.com, office@example.org');
    // RFC 5322 §3.4: "Groundwork <no-reply@example.org>" is a name-addr; the address is inside <>.
    expect(m.from).toBe('no-reply@example.org');
    expect(m.subject).toBe('Your charge point checklist');
    expect(m.text).toContain('Please add a photo of your consumer unit.');
    expect(m.html).toContain('<strong>consumer unit</strong>');
    expect(Object.keys(m).sort()).toEqual(['date', 'from', 'html', 'id', 'subject', 'text', 'to']);
    // ISO 8601 as written by Date#toISOString, e.g. 2025-01-31T09:05:00.000Z. The Date header
    // has one-second resolution (RFC 5322 §3.3), so allow a second either side of the send.
    expect(m.date).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
    const sentAt = Date.parse(m.date);
    expect(sentAt).toBeGreaterThanOrEqual(before - 1000);
    expect(sentAt).toBeLessThanOrEqual(Date.now() + 1000);

    const one = await fetch(`${api}/api/messages/${encodeURIComponent(m.id)}`);
    expect(one.status).toBe(200);
    expect(await one.json()).toEqual(m);
  });

  it('answers 404 in the app error shape for an unknown id', async () => {
    const res = await fetch(`${api}/api/messages/does-not-exist`);
    expect(res.status).toBe(404);
    const body = (await res.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe('not_found');
  });

  it('lists messages oldest first, newest last', async () => {
    await send({ to: 'first@example.com', subject: 'First', text: 'one' });
    await send({ to: 'second@example.com', subject: 'Second', text: 'two' });
    const subjects = (await listMessages()).map((m) => m.subject);
    expect(subjects).toEqual(['First', 'Second']);
  });

  it('filters by recipient with ?to=, ignoring case', async () => {
    await send({ to: 'alex.morgan@example.com', subject: 'For Alex', text: 'a' });
    await send({ to: 'jo.baker@example.com', subject: 'For Jo', text: 'b' });
    await send({ to: 'jo.baker@example.com', cc: 'Alex.Morgan@Example.com', subject: 'For Jo, copy to Alex', text: 'c' });

    // RFC 5321 §2.4: the domain part is case-insensitive, and mail systems treat the local
    // part the same way in practice, so a mixed-case query must still match.
    const forAlex = await listMessages(`?to=${encodeURIComponent('ALEX.MORGAN@example.COM')}`);
    // Worked by hand: "For Alex" (To) and "For Jo, copy to Alex" (Cc) reach Alex; "For Jo" does not.
    expect(forAlex.map((m) => m.subject)).toEqual(['For Alex', 'For Jo, copy to Alex']);

    const forJo = await listMessages('?to=jo.baker@example.com');
    expect(forJo.map((m) => m.subject)).toEqual(['For Jo', 'For Jo, copy to Alex']);

    expect(await listMessages('?to=nobody@example.com')).toEqual([]);
  });

  it('finds a Bcc recipient by the SMTP envelope, though no header names them', async () => {
    // RFC 5322 §3.6.3: Bcc addresses are removed from the header; only RCPT TO (RFC 5321
    // §3.3) carries them, so the filter has to read the envelope.
    await send({ to: 'customer@example.com', bcc: 'audit@example.org', subject: 'Copy kept', text: 'x' });
    const forAudit = await listMessages('?to=audit@example.org');
    expect(forAudit.map((m) => m.subject)).toEqual(['Copy kept']);
    expect(forAudit[0].to).toBe('customer@example.com');
  });

  it('accepts any AUTH credentials over plain text, as a local stand-in should', async () => {
    // RFC 4954 §4: the server answers 235 to a successful AUTH; nodemailer only sends once it has.
    const info = await send(
      { to: 'signed-in@example.com', subject: 'With auth', text: 'x' },
      { auth: { user: 'any-user', pass: 'any-password' } },
    );
    expect(info.response).toMatch(/^250/);
    expect((await listMessages()).map((m) => m.subject)).toEqual(['With auth']);
  });

  it('DELETE /api/messages clears the inbox with 204', async () => {
    await send({ to: 'someone@example.com', subject: 'To be cleared', text: 'x' });
    expect(await listMessages()).toHaveLength(1);
    // RFC 9110 §15.3.5: 204 No Content has no body.
    const res = await fetch(`${api}/api/messages`, { method: 'DELETE' });
    expect(res.status).toBe(204);
    expect(await res.text()).toBe('');
    expect(await listMessages()).toEqual([]);
  });
});

describe('fake mail server: HTML inbox', () => {
  const hostile = '<script>alert("x")</script> & "quotes"';

  it('escapes a subject containing <script> on the inbox page', async () => {
    await send({ to: 'victim@example.com', subject: hostile, text: 'plain' });
    const res = await fetch(`${api}/`);
    expect(res.status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/html/);
    const page = await res.text();
    expect(page).toContain('<title>Groundwork — local test inbox</title>');
    // HTML Living Standard §13.1.2.6 (character references): < > & " written as &lt; &gt; &amp; &quot;.
    expect(page).toContain('&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &quot;quotes&quot;');
    expect(page).not.toContain('<script');
  });

  it('shows the newest message first on the inbox page', async () => {
    await send({ to: 'a@example.com', subject: 'Older one', text: 'x' });
    await send({ to: 'a@example.com', subject: 'Newer one', text: 'x' });
    const page = await (await fetch(`${api}/`)).text();
    expect(page.indexOf('Newer one')).toBeGreaterThan(-1);
    expect(page.indexOf('Newer one')).toBeLessThan(page.indexOf('Older one'));
  });

  it('renders a message page with the HTML part in a script-free sandbox and the text in <pre>', async () => {
    await send({
      to: 'viewer@example.com',
      subject: hostile,
      text: 'Sign in: https://groundwork.example.com/sign-in?token=abc&case=1\n<b>not bold</b>',
      html: '<p onclick="x()">Hi</p><script>alert(1)</script>',
    });
    const [m] = await listMessages();
    const page = await (await fetch(`${api}/messages/${m.id}`)).text();
    expect(page).not.toContain('<script');
    expect(page).toContain('<h1>&lt;script&gt;alert(&quot;x&quot;)&lt;/script&gt; &amp; &quot;quotes&quot;</h1>');

    const iframe = /<iframe\b[^>]*>/.exec(page)?.[0] ?? '';
    // HTML Living Standard §4.8.5: a sandbox attribute without allow-scripts stops all script.
    expect(iframe).toMatch(/\bsandbox="[^"]*"/);
    expect(iframe).not.toContain('allow-scripts');
    expect(iframe).not.toContain('allow-same-origin');
    // srcdoc holds the mail's HTML as an attribute value, so its < and " must be escaped.
    expect(iframe).toContain('srcdoc="');
    expect(iframe).toContain('&lt;p onclick=&quot;x()&quot;&gt;Hi&lt;/p&gt;&lt;script&gt;alert(1)&lt;/script&gt;');

    const pre = /<pre>([\s\S]*?)<\/pre>/.exec(page)?.[1] ?? '';
    expect(pre).toContain('&lt;b&gt;not bold&lt;/b&gt;');
    // The sign-in link is followable; & in an attribute is written &amp; (HTML §13.1.2.6).
    expect(pre).toContain('href="https://groundwork.example.com/sign-in?token=abc&amp;case=1"');
  });

  it('answers 404 for a message page that does not exist', async () => {
    const res = await fetch(`${api}/messages/999999`);
    expect(res.status).toBe(404);
  });
});

describe('fake mail server: memory cap', () => {
  it('keeps at most maxMessages, dropping the oldest', async () => {
    // A small cap stands in for the default 2000, which would take 2000 SMTP sessions to reach.
    const small = await startMailServer({ smtpPort: 0, httpPort: 0, quiet: true, maxMessages: 3 });
    const t = nodemailer.createTransport({ host: '127.0.0.1', port: small.smtpPort, secure: false, ignoreTLS: true, pool: true });
    try {
      // Sent one after another so arrival order is certain: m1, m2, m3, m4, m5.
      for (const subject of ['m1', 'm2', 'm3', 'm4', 'm5']) {
        await t.sendMail({ from: 'bulk@example.org', to: 'bulk@example.com', subject, text: subject });
      }
      const res = await fetch(`http://127.0.0.1:${small.httpPort}/api/messages`);
      const subjects = ((await res.json()) as ApiMessage[]).map((m) => m.subject);
      // Worked by hand: 5 in, cap 3, so the two oldest (m1, m2) go; order stays oldest first.
      expect(subjects).toEqual(['m3', 'm4', 'm5']);
    } finally {
      t.close();
      await small.close();
    }
  });

  it('refuses a cap below 1', async () => {
    await expect(startMailServer({ smtpPort: 0, httpPort: 0, quiet: true, maxMessages: 0 })).rejects.toThrow(/maxMessages/);
  });
});
