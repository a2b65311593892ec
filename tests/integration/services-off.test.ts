import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import { db, schema } from '../helpers/db';
import { eq } from 'drizzle-orm';
import { newCustomer, newStaff } from '../helpers/people';
import { waitForMessage } from '../helpers/mail';

// Each hosted service is optional in production: the same built app, started without the SMS
// provider's or the vehicle enquiry service's variables, must work with both features off.

let app: ChildProcess;
let url = '';

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = net.createServer();
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      s.close(() => resolve(typeof a === 'object' && a ? a.port : 0));
    });
  });

beforeAll(async () => {
  const entry = process.env.APP_ENTRY;
  if (!entry) throw new Error('APP_ENTRY is not set: run through `npm test`.');
  const port = await freePort();
  url = `http://127.0.0.1:${port}`;
  const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => !k.startsWith('VONAGE_') && !k.startsWith('VEHICLE_ENQUIRY') && k !== 'SMS_FROM'));
  app = spawn('node', [entry], { env: { ...env, PORT: String(port) }, stdio: 'ignore' });
  for (let i = 0; i < 100; i++) {
    if (await fetch(`${url}/api/health`).then((r) => r.ok, () => false)) return;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error('the second app did not start');
});

afterAll(() => {
  app?.kill('SIGTERM');
});

describe('with the SMS and vehicle services unset', () => {
  it('the look-up answers "off", the texts say disabled, webhooks 404, and a chase still e-mails', async () => {
    const { client, case: c, user } = await newCustomer({ stage: 'invited' });
    const at = (path: string) => `${url}${path}`;
    expect((await client.send('POST', at(`/api/cases/${c!.id}/vehicle-lookup`), { registration: 'GW29 EVA' })).body).toEqual({ status: 'off' });
    expect((await client.json(at(`/api/cases/${c!.id}/texts`))).body).toMatchObject({ enabled: false, consented: false });
    expect((await client.send('PUT', at(`/api/cases/${c!.id}/texts`), { mobile: '07400 123987', agree: true })).status).toBe(409);
    expect((await fetch(at('/api/sms/inbound'), { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"text":"STOP"}' })).status).toBe(404);
    expect((await fetch(at('/api/sms/status'), { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{}' })).status).toBe(404);

    // The checklist itself saves as ever.
    const saved = await client.send('PATCH', at(`/api/cases/${c!.id}/checklist`), { vehicle: { registration: 'GW29 EVA', make: 'Larkspur' } });
    expect(saved.status).toBe(200);

    const { client: admin } = await newStaff('admin');
    const chase = await admin.send('POST', at(`/api/cases/${c!.id}/chase`), {});
    expect(chase.status).toBe(200);
    expect(chase.body.text).toMatchObject({ sent: false, reason: 'Text messages are switched off.' });
    await waitForMessage(user.email, 2);
    expect(await db.select().from(schema.textLog).where(eq(schema.textLog.caseId, c!.id))).toHaveLength(0);
    const page = await admin.fetch(at(`/office/cases/${c!.id}`));
    expect(page.status).toBe(200);
  });
});
