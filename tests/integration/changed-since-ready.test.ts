// A case the office has marked Ready for survey does not change behind its back: the customer's
// later edits and uploads flag it in the queue and on the case page, list what changed, and the
// first one e-mails the office. Moving the case on clears the flag.
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { newCustomer, newStaff } from '../helpers/people';
import { smallImage } from '../fixtures/uploads';

let admin: Client;
let surveyorId: string;
let officeEmail: string;

beforeAll(async () => {
  admin = (await newStaff('admin')).client;
  surveyorId = (await newStaff('surveyor')).user.id;
  const [firm] = await db.select().from(schema.settings).where(eq(schema.settings.key, 'firm'));
  officeEmail = (firm?.value as { email?: string } | undefined)?.email ?? 'office@example.com';
});

const queueItem = async (reference: string) =>
  ((await admin.json(`/api/cases?q=${encodeURIComponent(reference)}`)).body.items as { reference: string; changedSinceReadyAt: string | null }[]).find((i) => i.reference === reference)!;
const officeMailsAbout = async (reference: string) => (await messagesTo(officeEmail)).filter((m) => m.subject.includes(`${reference} changed after it was marked ready`));

describe('changes after the case was marked ready', () => {
  it('flags answers and uploads sent after sign-off, tells the office once, and clears on booking', async () => {
    const { client: customer, case: c } = await newCustomer({ stage: 'ready_for_survey', checklist: { supply: { mainFuseAmps: 100 } } });
    expect((await queueItem(c!.reference)).changedSinceReadyAt).toBeNull();

    expect((await customer.send('PATCH', `/api/cases/${c!.id}/checklist`, { supply: { mainFuseAmps: 60 } })).status).toBe(200);
    expect((await queueItem(c!.reference)).changedSinceReadyAt).not.toBeNull();
    const form = new FormData();
    form.set('kind', 'cutout_photo');
    form.set('file', new Blob([new Uint8Array(await smallImage('jpeg'))], { type: 'image/jpeg' }), 'cutout.jpg');
    expect((await customer.json(`/api/cases/${c!.id}/uploads`, { method: 'POST', body: form })).status).toBe(201);

    const asOffice = await admin.json(`/api/cases/${c!.id}`);
    const changes = asOffice.body.changedSinceReady.changes as { what: string; detail: string }[];
    expect(changes.map((x) => x.what)).toEqual(['answers', 'upload_added']);
    expect(changes[0]!.detail).toBe('Main fuse (cut-out), as read');
    // The office page shows it too.
    expect(await (await admin.fetch(`/office/cases/${c!.id}`)).text()).toContain('Changed since it was marked ready');
    // The customer does not get the office's view of it.
    expect((await customer.json(`/api/cases/${c!.id}`)).body.changedSinceReady).toBeNull();

    await new Promise((r) => setTimeout(r, 300));
    expect(await officeMailsAbout(c!.reference)).toHaveLength(1);

    const booked = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'survey_booked', surveyorId, surveyDate: '2099-05-01' });
    expect(booked.status).toBe(200);
    expect((await queueItem(c!.reference)).changedSinceReadyAt).toBeNull();
  });

  it('does not flag changes before sign-off, or the office’s own edits', async () => {
    const { client: customer, case: c } = await newCustomer({ stage: 'in_review' });
    expect((await customer.send('PATCH', `/api/cases/${c!.id}/checklist`, { supply: { mainFuseAmps: 80 } })).status).toBe(200);
    expect((await queueItem(c!.reference)).changedSinceReadyAt).toBeNull();
    await db.update(schema.cases).set({ stage: 'ready_for_survey' }).where(eq(schema.cases.id, c!.id));
    expect((await admin.send('PATCH', `/api/cases/${c!.id}/checklist`, { supply: { mainFuseAmps: 100 } })).status).toBe(200);
    expect((await queueItem(c!.reference)).changedSinceReadyAt).toBeNull();
  });
});
