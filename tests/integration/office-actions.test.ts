import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client, baseUrl, signInWithPassword } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { linkIn, messagesTo, waitForMessage } from '../helpers/mail';
import { newCustomer, newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';

let admin: Client;
let adminId: string;
beforeAll(async () => {
  const a = await newStaff('admin');
  admin = a.client;
  adminId = a.user.id;
});

const unique = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e6).toString(36)}`;
const caseRow = async (id: string) => (await db.select().from(schema.cases).where(eq(schema.cases.id, id)))[0]!;

describe('POST /api/cases — invitations', () => {
  it('creates the customer and case, e-mails a link that signs them in and lands on the case', async () => {
    const email = `invitee-${unique()}@example.org`;
    const r = await admin.send('POST', '/api/cases', {
      customer: { name: 'Imogen Fairweather', email: email.toUpperCase(), phone: '0113 496 0123' },
      address: { addressLine1: '4 Lantern Yard', town: 'Quillbury', postcode: 'ab1 2de' },
      note: 'Car due in spring.',
    });
    expect(r.status).toBe(201);
    const row = await caseRow(r.body.id);
    expect(row).toMatchObject({ stage: 'invited', postcode: 'AB1 2DE', addressLine1: '4 Lantern Yard' });
    expect(row.checklist).toMatchObject({ about: { fullName: 'Imogen Fairweather', email, phone: '+441134960123' } });
    // Filled in from the invitation, so marked for the customer to check until they confirm it.
    expect([...row.prefilled].sort()).toEqual(['about.addressLine1', 'about.email', 'about.fullName', 'about.phone', 'about.postcode', 'about.town']);
    const mail = await waitForMessage(email);
    expect(mail.text).toContain('MPAN');
    expect(mail.text).toContain('Car due in spring.');
    const customer = new Client();
    const res = await customer.fetch(linkIn(mail, baseUrl));
    expect(res.headers.get('location')).toBe(`${baseUrl}/my/cases/${r.body.id}`);
    expect((await customer.json('/api/me')).body.email).toBe(email);
    const history = await admin.json(`/api/cases/${r.body.id}/emails`);
    expect(history.body.items.map((e: { kind: string }) => e.kind)).toEqual(['invitation']);
  });

  it('answers 409 with a link to the open case when the e-mail already has one', async () => {
    const { user, case: c } = await newCustomer({});
    const r = await admin.send('POST', '/api/cases', { customer: { name: 'Again', email: user.email } });
    expect(r.status).toBe(409);
    expect(r.body.error).toMatchObject({ code: 'conflict', caseId: c!.id, url: `/office/cases/${c!.id}` });
  });

  it('names each bad field with 422, and lets only admins invite', async () => {
    const bad = await admin.send('POST', '/api/cases', { customer: { name: '', email: 'nope' }, address: { postcode: 'ZZZ' } });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['address.postcode', 'customer.email', 'customer.name']);
    const { client: customer } = await newCustomer(null);
    const { client: surveyor } = await newStaff('surveyor');
    const body = { customer: { name: 'X', email: `x-${unique()}@example.org` } };
    expect((await customer.send('POST', '/api/cases', body)).status).toBe(403);
    expect((await surveyor.send('POST', '/api/cases', body)).status).toBe(403);
  });

  it('previews a CSV import with per-row errors and creates nothing until every row is fine', async () => {
    const { user: existing } = await newCustomer({});
    const e1 = `bulk1-${unique()}@example.org`;
    const e2 = `bulk2-${unique()}@example.org`;
    const rows = [
      { customer: { name: 'Row One', email: e1 } },
      { customer: { name: '', email: 'broken' } },
      { customer: { name: 'Row Three', email: e1 } },
      { customer: { name: 'Row Four', email: existing.email } },
    ];
    const preview = await admin.send('POST', '/api/cases/import', { rows, dryRun: true });
    expect(preview.status).toBe(200);
    expect(preview.body.results.map((r: { ok: boolean }) => r.ok)).toEqual([true, false, false, false]);
    expect(preview.body.results[2].fields['customer.email']).toContain('row 1');
    expect(preview.body.results[3].fields['customer.email']).toContain('open case');
    const refused = await admin.send('POST', '/api/cases/import', { rows, dryRun: false });
    expect(refused.status).toBe(422);
    expect(await messagesTo(e1)).toHaveLength(0);
    const good = await admin.send('POST', '/api/cases/import', { rows: [{ customer: { name: 'Row One', email: e1 } }, { customer: { name: 'Row Two', email: e2 } }], dryRun: false });
    expect(good.status).toBe(201);
    expect(good.body.created).toBe(2);
    await waitForMessage(e2);
  });
});

describe('POST /api/cases/:id/stage', () => {
  it('allows only the next stage or Withdrawn, answering 409 with the allowed moves', async () => {
    const { case: c } = await newCustomer({ stage: 'filling_in' });
    const jump = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'survey_booked' });
    expect(jump.status).toBe(409);
    expect(jump.body.error.allowed).toEqual(['sent_for_review', 'withdrawn']);
    const ok = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'sent_for_review' });
    expect(ok.status).toBe(200);
    expect(ok.body.stage).toBe('sent_for_review');
    const withdrawn = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'withdrawn' });
    expect(withdrawn.body.stage).toBe('withdrawn');
    const after = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'in_review' });
    expect(after.status).toBe(409);
    expect(after.body.error.allowed).toEqual([]);
    const log = await admin.json(`/api/cases/${c!.id}/audit`);
    const moves = log.body.items.filter((e: { action: string }) => e.action === 'stage.changed');
    expect(moves.map((e: { after: { stage: string } }) => e.after.stage)).toEqual(['withdrawn', 'sent_for_review']);
    expect(moves[0].actorId).toBe(adminId);
  });

  it('needs a written reason to pass a case with red checks to Ready for survey', async () => {
    const { case: c } = await newCustomer({ stage: 'in_review', checklist: { parking: { kind: 'none' } } });
    const refused = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'ready_for_survey' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.red.map((r: { id: string }) => r.id)).toContain('parking');
    const short = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'ready_for_survey', overrideReason: 'ok' });
    expect(short.status).toBe(422);
    const overridden = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'ready_for_survey', overrideReason: 'Customer is buying the neighbouring drive; survey anyway.' });
    expect(overridden.status).toBe(200);
    const entry = (await admin.json(`/api/cases/${c!.id}/audit`)).body.items[0];
    expect(entry.after.overrideReason).toContain('neighbouring drive');
  });

  it('books a survey only with an active surveyor and a date, and e-mails the customer', async () => {
    const { case: c, user } = await newCustomer({ stage: 'ready_for_survey' });
    const missing = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'survey_booked' });
    expect(missing.status).toBe(422);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(['surveyDate', 'surveyorId']);
    const notSurveyor = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'survey_booked', surveyorId: adminId, surveyDate: '2099-01-05' });
    expect(notSurveyor.body.error.fields).toHaveProperty('surveyorId');
    const past = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'survey_booked', surveyorId: adminId, surveyDate: '2001-01-05' });
    expect(past.body.error.fields).toHaveProperty('surveyDate');
    const surveyor = await createUser(db, { role: 'surveyor', name: 'Ottilie Brack' });
    const booked = await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'survey_booked', surveyorId: surveyor.id, surveyDate: '2099-01-05' });
    expect(booked.status).toBe(200);
    expect(await caseRow(c!.id)).toMatchObject({ stage: 'survey_booked', surveyorId: surveyor.id, surveyDate: '2099-01-05' });
    const mail = await waitForMessage(user.email, 2);
    expect(mail.subject).toContain('Monday, 5 January 2099');
    expect(mail.text).toContain('Ottilie Brack');
  });

  it('refuses customers and surveyors', async () => {
    const { client, case: c } = await newCustomer({ stage: 'filling_in' });
    expect((await client.send('POST', `/api/cases/${c!.id}/stage`, { to: 'sent_for_review' })).status).toBe(403);
    const { client: surveyor } = await newStaff('surveyor');
    expect((await surveyor.send('POST', `/api/cases/${c!.id}/stage`, { to: 'sent_for_review' })).status).toBe(403);
    expect((await admin.send('POST', `/api/cases/${c!.id}/stage`, { to: 'nowhere' })).status).toBe(422);
  });
});

describe('chasing, notes and the audit trail', () => {
  it('chases with exactly what is missing, in plain words, with a sign-in link', async () => {
    const { case: c, user } = await newCustomer({ checklist: { about: { fullName: 'Chase Me' }, parking: { kind: 'detached-bay' } } });
    const r = await admin.send('POST', `/api/cases/${c!.id}/chase`, {});
    expect(r.status).toBe(200);
    expect(r.body.items).toContain('Upload a document showing the parking space is yours to use.');
    const mail = await waitForMessage(user.email, 2);
    expect(mail.text).toContain('Your supply: add the MPAN (the 13-digit supply number on your electricity bill)');
    expect(mail.text).toContain('Upload a photo of the main fuse (cut-out).');
    expect(linkIn(mail, baseUrl)).toContain('/api/auth/callback/nodemailer');
    const history = (await admin.json(`/api/cases/${c!.id}/emails`)).body.items;
    expect(history[0]).toMatchObject({ kind: 'chase', toEmail: user.email });
  });

  it('bulk-chases a selection and reports each case', async () => {
    const a = await newCustomer({});
    const b = await newCustomer({});
    const r = await admin.send('POST', '/api/cases/chase', { caseIds: [a.case!.id, b.case!.id, '00000000-0000-4000-8000-000000000000'] });
    expect(r.status).toBe(200);
    expect(r.body.sent).toBe(2);
    expect(r.body.results.find((x: { caseId: string }) => x.caseId.startsWith('00000000')).reason).toBe('Case not found.');
    expect((await admin.send('POST', '/api/cases/chase', { caseIds: [] })).status).toBe(422);
    expect((await a.client.send('POST', '/api/cases/chase', { caseIds: [a.case!.id] })).status).toBe(403);
  });

  it('adds notes, and shows them with the audit trail to staff only', async () => {
    const { case: c, client: customer } = await newCustomer({});
    const added = await admin.send('POST', `/api/cases/${c!.id}/notes`, { body: 'Rang the customer: meter is in the garage.' });
    expect(added.status).toBe(201);
    expect((await admin.send('POST', `/api/cases/${c!.id}/notes`, { body: '   ' })).status).toBe(422);
    const notes = await admin.json(`/api/cases/${c!.id}/notes`);
    expect(notes.body.items.map((n: { body: string }) => n.body)).toEqual(['Rang the customer: meter is in the garage.']);
    const log = await admin.json(`/api/cases/${c!.id}/audit`);
    expect(log.body.items[0]).toMatchObject({ action: 'note.added', actorId: adminId });
    expect((await customer.json(`/api/cases/${c!.id}/notes`)).status).toBe(403);
    expect((await customer.json(`/api/cases/${c!.id}/audit`)).status).toBe(403);
  });
});

describe('staff and settings', () => {
  it('invites a surveyor who sets a password once and signs in; deactivation stops them', async () => {
    const email = `newstaff-${unique()}@example.com`;
    const r = await admin.send('POST', '/api/staff', { name: 'Perpetua Lowe', email, role: 'surveyor' });
    expect(r.status).toBe(201);
    const link = linkIn(await waitForMessage(email), baseUrl);
    const url = new URL(link);
    const body = { email, token: url.searchParams.get('token'), password: 'a long enough password' };
    expect((await new Client().send('POST', '/api/staff/password', { ...body, password: 'short' })).status).toBe(422);
    expect((await new Client().send('POST', '/api/staff/password', body)).status).toBe(200);
    expect((await new Client().send('POST', '/api/staff/password', body)).status).toBe(400);
    const surveyor = await signInWithPassword(email, 'a long enough password');
    expect((await surveyor.json('/api/me')).body.role).toBe('surveyor');
    expect((await admin.send('PATCH', `/api/staff/${r.body.id}`, { active: false })).status).toBe(200);
    expect((await surveyor.json('/api/me')).status).toBe(401);
    expect((await admin.send('PATCH', `/api/staff/${adminId}`, { active: false })).status).toBe(409);
    expect((await surveyor.json('/api/staff')).status).toBe(401);
  });

  it('changes a readiness threshold and recomputes open cases', async () => {
    // 80 A fuse, every load answered "none", one socket circuit, a 3.6 kW charger (IET OSG Table A2,
    // second-hand): 32 A + lighting 66% × 2000 / 230 = 5.74 A + 16 A (722.311) = 53.74 A → 26.26 A spare (green).
    const { case: c } = await newCustomer({
      checklist: {
        supply: { mainFuseAmps: 80, loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 1 } },
        charger: { ratingKw: 3.6 },
      },
    });
    const before = await admin.json(`/api/cases/${c!.id}/readiness`);
    expect(before.body.checks.find((x: { id: string }) => x.id === 'supply-headroom').light).toBe('green');
    const settings = await admin.json('/api/settings');
    expect(settings.body.readiness.headroomMarginAmps).toBe(10);
    // A 40 A margin makes 26.26 A of headroom "close": amber.
    const put = await admin.send('PUT', '/api/settings', { readiness: { headroomMarginAmps: 40 } });
    expect(put.status).toBe(200);
    try {
      const after = await admin.json(`/api/cases/${c!.id}/readiness`);
      expect(after.body.checks.find((x: { id: string }) => x.id === 'supply-headroom').light).toBe('amber');
      // The stored light (what the queue filters on) follows once the worker's recompute job runs.
      const stored = async () => (await caseRow(c!.id)).readinessChecks as { id: string; light: string }[];
      for (let i = 0; i < 100 && !(await stored()).some((x) => x.id === 'supply-headroom' && x.light === 'amber'); i++) {
        await new Promise((r) => setTimeout(r, 200));
      }
      expect(await stored()).toEqual(expect.arrayContaining([expect.objectContaining({ id: 'supply-headroom', light: 'amber' })]));
      expect((await admin.send('PUT', '/api/settings', { readiness: { headroomMarginAmps: -1 } })).status).toBe(422);
      expect((await admin.send('PUT', '/api/settings', { readiness: { noSuchThing: 1 } })).status).toBe(422);
      // Only real ratings: a 20 A charger or a 45 A device is refused.
      expect((await admin.send('PUT', '/api/settings', { readiness: { chargerAmps: 20 } })).status).toBe(422);
      expect((await admin.send('PUT', '/api/settings', { readiness: { protectiveDeviceAmps: 45 } })).status).toBe(422);
    } finally {
      await admin.send('PUT', '/api/settings', { readiness: { headroomMarginAmps: 10 } });
    }
  });
});

describe('readiness through the API', () => {
  it('changes the stored readiness when answers are saved, and hides it from other customers', async () => {
    const a = await newCustomer({});
    const b = await newCustomer({});
    await a.client.send('PATCH', `/api/cases/${a.case!.id}/checklist`, { parking: { kind: 'none' } });
    expect((await caseRow(a.case!.id)).readinessLight).toBe('red');
    const r = await a.client.json(`/api/cases/${a.case!.id}/readiness`);
    expect(r.body.light).toBe('red');
    expect(r.body.checks.find((x: { id: string }) => x.id === 'parking').light).toBe('red');
    await a.client.send('PATCH', `/api/cases/${a.case!.id}/checklist`, { parking: { kind: 'garage' } });
    expect((await caseRow(a.case!.id)).readinessLight).not.toBe('red');
    expect((await b.client.json(`/api/cases/${a.case!.id}/readiness`)).status).toBe(404);
  });
});

void createCase;
