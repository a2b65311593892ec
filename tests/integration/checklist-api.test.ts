import { beforeAll, describe, expect, it } from 'vitest';
import { and, asc, eq } from 'drizzle-orm';
import { Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { messagesTo, waitForMessage } from '../helpers/mail';
import { newCustomer, newStaff } from '../helpers/people';

type Signed = Awaited<ReturnType<typeof newCustomer>>;

const patch = (c: Signed, body: unknown, headers: Record<string, string> = {}) =>
  c.client.json(`/api/cases/${c.case!.id}/checklist`, {
    method: 'PATCH',
    headers: { 'content-type': 'application/json', ...headers },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });

const rowOf = async (c: Signed) => (await db.select().from(schema.cases).where(eq(schema.cases.id, c.case!.id)))[0]!;

describe('GET /api/cases and /api/cases/:id', () => {
  it('gives a customer their own cases only, and 404 for anyone else’s', async () => {
    const a = await newCustomer({ addressLine1: '1 Alder Way' });
    const b = await newCustomer({ addressLine1: '2 Birch Way' });
    const list = await a.client.json('/api/cases');
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(1);
    expect(list.body.items.map((i: { id: string }) => i.id)).toEqual([a.case!.id]);
    const mine = await a.client.json(`/api/cases/${a.case!.id}`);
    expect(mine.status).toBe(200);
    expect(mine.body).toMatchObject({ id: a.case!.id, stage: 'invited', version: 1, checklist: {}, editable: true });
    expect(mine.body.progress).toHaveLength(5);
    const theirs = await a.client.json(`/api/cases/${b.case!.id}`);
    expect(theirs.status).toBe(404);
    expect(theirs.body.error.code).toBe('not_found');
    expect((await a.client.json('/api/cases/not-a-uuid')).status).toBe(404);
  });

  it('answers 401 to anonymous callers', async () => {
    const a = await newCustomer();
    expect((await new Client().json('/api/cases')).status).toBe(401);
    expect((await new Client().json(`/api/cases/${a.case!.id}`)).status).toBe(401);
    const anon = await new Client().json(`/api/cases/${a.case!.id}/checklist`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/json' },
      body: '{}',
    });
    expect(anon.status).toBe(401);
  });
});

describe('PATCH /api/cases/:id/checklist', () => {
  let c: Signed;
  beforeAll(async () => {
    c = await newCustomer({});
  });

  it('merges given fields, stores the MPAN as digits only and shows the region back', async () => {
    // MRA/Elexon MPAN check digit, worked example in TRADE-REFERENCE: 1312345678907, sum 1349,
    // 1349 mod 11 = 7 → check digit 7. Distributor 13 = Merseyside, Cheshire and North Wales.
    const r = await patch(c, { supply: { mpanCore: '13 1234 5678 907', mainFuseAmps: 100 } });
    expect(r.status).toBe(200);
    expect(r.body.checklist.supply).toEqual({ mpanCore: '1312345678907', mainFuseAmps: 100 });
    expect(r.body.region).toBe('Merseyside, Cheshire and North Wales');
    const again = await patch(c, { supply: { earthing: 'pme' } });
    expect(again.body.checklist.supply).toEqual({ mpanCore: '1312345678907', mainFuseAmps: 100, earthing: 'pme' });
    expect(again.body.version).toBe(r.body.version + 1);
    expect((await rowOf(c)).stage).toBe('filling_in');
  });

  it('accepts a core whose check digit is 0 (sum mod 11 = 10)', async () => {
    // 131234567898 × weights 3,5,7,13,17,19,23,29,31,37,41,43:
    // 3+15+7+26+51+76+115+174+217+296+369+344 = 1693; 1693 mod 11 = 10 → 10 mod 10 = 0.
    const r = await patch(c, { supply: { mpanCore: '1312345678980' } });
    expect(r.status).toBe(200);
    expect(r.body.checklist.supply.mpanCore).toBe('1312345678980');
  });

  it.each([
    ['a wrong check digit', '1312345678906'],
    ['12 digits', '131234567890'],
    ['14 digits', '13123456789070'],
    ['letters', '13123456789O7'],
  ])('refuses %s with 422 naming supply.mpanCore, and saves nothing', async (_label, mpanCore) => {
    const before = await rowOf(c);
    const r = await patch(c, { about: { town: 'Should Not Save' }, supply: { mpanCore } });
    expect(r.status).toBe(422);
    expect(r.body.error.code).toBe('invalid');
    expect(Object.keys(r.body.error.fields)).toEqual(['supply.mpanCore']);
    const after = await rowOf(c);
    expect(after.checklist).toEqual(before.checklist);
    expect(after.version).toBe(before.version);
  });

  it('accepts the 49 CFR 565.15 worked VIN, and keeps a European VIN with a warning', async () => {
    // 1M8GDM9AXKP042788: weighted sum 351, 351 mod 11 = 10 → check character X, which it has.
    const ok = await patch(c, { vehicle: { vin: '1m8gdm9axkp042788' } });
    expect(ok.status).toBe(200);
    expect(ok.body.checklist.vehicle.vin).toBe('1M8GDM9AXKP042788');
    expect(ok.body.warnings['vehicle.vin']).toBeUndefined();
    // Same VIN with position 9 changed to 1: fails the North American check, which a European VIN need not pass.
    const warned = await patch(c, { vehicle: { vin: '1M8GDM9A1KP042788' } });
    expect(warned.status).toBe(200);
    expect(warned.body.warnings['vehicle.vin']).toBeTruthy();
    const refused = await patch(c, { vehicle: { vin: '1M8GDM9AXKP04278O' } });
    expect(refused.status).toBe(422);
    expect(refused.body.error.fields['vehicle.vin']).toMatch(/O/);
  });

  it.each([
    // DVLA INF104 formats, each normalised to upper case with the usual space.
    ['current (March identifier)', 'ab12cde', 'AB12 CDE'],
    ['current (September identifier)', 'AB62CDE', 'AB62 CDE'],
    ['suffix 1963–82', 'abc123a', 'ABC 123A'],
    ['prefix 1983–2001', 'a123abc', 'A123 ABC'],
  ])('saves a %s registration', async (_label, input, saved) => {
    const r = await patch(c, { vehicle: { registration: input } });
    expect(r.status).toBe(200);
    expect(r.body.checklist.vehicle.registration).toBe(saved);
  });

  it('refuses characters no plate carries', async () => {
    const r = await patch(c, { vehicle: { registration: 'AB12-CD!' } });
    expect(r.status).toBe(422);
    expect(Object.keys(r.body.error.fields)).toEqual(['vehicle.registration']);
  });

  it('normalises postcode and phone, and refuses bad ones by field', async () => {
    // BS 7666 postcode: outward AA9A, inward 9AA. Ofcom drama-range number 0113 496 0000.
    const r = await patch(c, { about: { postcode: 'ec1a1bb', phone: '0113 496 0000' } });
    expect(r.status).toBe(200);
    expect(r.body.checklist.about).toMatchObject({ postcode: 'EC1A 1BB', phone: '+441134960000' });
    const bad = await patch(c, { about: { postcode: 'QQ1 1AA', phone: '12' }, vehicle: { deliveryDate: '2026-02-30' } });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['about.phone', 'about.postcode', 'vehicle.deliveryDate']);
  });

  it('clears a field with null, and keeps null as an answer for an unreadable main fuse', async () => {
    await patch(c, { about: { town: 'Quillbury' }, supply: { mainFuseAmps: 80 } });
    const r = await patch(c, { about: { town: null }, supply: { mainFuseAmps: null } });
    expect(r.status).toBe(200);
    expect(r.body.checklist.about.town).toBeUndefined();
    expect(r.body.checklist.supply.mainFuseAmps).toBeNull();
  });

  it('refuses an 11 or 22 kW charge point on a single-phase supply, saving nothing', async () => {
    // An 11 or 22 kW charge point needs three phases (11 kW ≈ 16 A, 22 kW ≈ 32 A per phase: common practice).
    expect((await patch(c, { supply: { phases: 'single' } })).status).toBe(200);
    const versionBefore = (await rowOf(c)).version;
    const r = await patch(c, { charger: { ratingKw: 22 } });
    expect(r.status).toBe(422);
    expect(r.body.error.fields['charger.ratingKw']).toMatch(/three-phase supply/);
    expect((await rowOf(c)).version).toBe(versionBefore);
    // Changing both at once is fine, and so is 7.4 kW on single phase.
    expect((await patch(c, { supply: { phases: 'three' }, charger: { ratingKw: 22 } })).status).toBe(200);
    expect((await patch(c, { supply: { phases: 'single' } })).status).toBe(422);
    expect((await patch(c, { supply: { phases: 'single' }, charger: { ratingKw: 7.4 } })).status).toBe(200);
  });

  it('refuses unknown sections and fields with their dotted paths', async () => {
    const r = await patch(c, { supply: { mpan: '1' }, garden: {} });
    expect(r.status).toBe(422);
    expect(r.body.error.fields).toHaveProperty('supply.mpan');
    expect(r.body.error.fields).toHaveProperty('garden');
  });

  it('answers 400 to a body that is not JSON, and 415 to a form post', async () => {
    const r = await patch(c, '{not json');
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('bad_request');
    const form = await c.client.json(`/api/cases/${c.case!.id}/checklist`, {
      method: 'PATCH',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'a=b',
    });
    expect(form.status).toBe(415);
  });

  it('refuses a stale If-Match with 409 and the newer case, saving nothing', async () => {
    const current = (await c.client.json(`/api/cases/${c.case!.id}`)).body;
    const first = await patch(c, { about: { fullName: 'Tab One' } }, { 'if-match': String(current.version) });
    expect(first.status).toBe(200);
    const second = await patch(c, { about: { fullName: 'Tab Two' } }, { 'if-match': String(current.version) });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('conflict');
    expect(second.body.error.current.checklist.about.fullName).toBe('Tab One');
    expect((await rowOf(c)).checklist).toMatchObject({ about: { fullName: 'Tab One' } });
  });

  it('records every change in the audit log with before and after', async () => {
    await patch(c, { parking: { kind: 'garage', cars: 2 } });
    const entries = await db
      .select()
      .from(schema.auditLog)
      .where(and(eq(schema.auditLog.caseId, c.case!.id), eq(schema.auditLog.action, 'checklist.updated')))
      .orderBy(asc(schema.auditLog.id));
    const last = entries.at(-1)!;
    expect(last.actorId).toBe(c.user.id);
    expect(last.after).toEqual({ 'parking.kind': 'garage', 'parking.cars': 2 });
    expect(last.before).toEqual({ 'parking.kind': null, 'parking.cars': null });
  });

  it('lets a surveyor read an assigned case but not change it', async () => {
    const { client: surveyor, user } = await newStaff('surveyor');
    await db.update(schema.cases).set({ surveyorId: user.id }).where(eq(schema.cases.id, c.case!.id));
    expect((await surveyor.json(`/api/cases/${c.case!.id}`)).status).toBe(200);
    const r = await surveyor.send('PATCH', `/api/cases/${c.case!.id}/checklist`, { about: { town: 'X' } });
    expect(r.status).toBe(403);
  });
});

describe('POST /api/cases/:id/submit', () => {
  it('asks to confirm the gaps, then sends the case and tells the office', async () => {
    const c = await newCustomer({});
    await patch(c, { about: { fullName: 'Gap Person' } });
    const first = await c.client.send('POST', `/api/cases/${c.case!.id}/submit`, {});
    expect(first.status).toBe(409);
    expect(first.body.error.gaps.map((g: { section: string }) => g.section)).toEqual(['about', 'vehicle', 'supply', 'parking', 'charger']);
    expect((await rowOf(c)).stage).toBe('filling_in');
    const before = (await messagesTo('office@example.com')).length;
    const sent = await c.client.send('POST', `/api/cases/${c.case!.id}/submit`, { acknowledgeGaps: true });
    expect(sent.status).toBe(200);
    expect(sent.body.stage).toBe('sent_for_review');
    const row = await rowOf(c);
    expect(row.stage).toBe('sent_for_review');
    expect(row.submittedAt).not.toBeNull();
    const mail = await waitForMessage('office@example.com', before + 1);
    expect(mail.subject).toContain(c.case!.reference);
    expect(mail.text).toContain('Your vehicle');
    const twice = await c.client.send('POST', `/api/cases/${c.case!.id}/submit`, { acknowledgeGaps: true });
    expect(twice.status).toBe(409);
  });

  it('refuses a bad body with 422 naming the field, and another customer with 404', async () => {
    const c = await newCustomer({});
    const other = await newCustomer({});
    const bad = await c.client.send('POST', `/api/cases/${c.case!.id}/submit`, { acknowledgeGaps: 'yes' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.fields).toHaveProperty('acknowledgeGaps');
    expect((await other.client.send('POST', `/api/cases/${c.case!.id}/submit`, { acknowledgeGaps: true })).status).toBe(404);
  });
});

describe('POST /api/cases/:id/confirm-details', () => {
  const confirm = (c: Signed, body: unknown) =>
    c.client.json(`/api/cases/${c.case!.id}/confirm-details`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });

  it('confirms one step’s details from the invitation, leaves the others marked, and records who did it', async () => {
    const c = await newCustomer({ addressLine1: '3 Mill Lane', town: 'Quillbury', postcode: 'AB12 7EF', fromInvitation: true });
    const before = await rowOf(c);
    expect([...before.prefilled].sort()).toEqual(['about.addressLine1', 'about.email', 'about.fullName', 'about.postcode', 'about.town']);
    const r = await confirm(c, { paths: ['about.fullName', 'about.email', 'about.phone'] });
    expect(r.status).toBe(200);
    expect([...r.body.prefilled].sort()).toEqual(['about.addressLine1', 'about.postcode', 'about.town']);
    const after = await rowOf(c);
    expect(after).toMatchObject({ stage: 'filling_in', version: before.version + 1, checklist: before.checklist });
    expect(after.detailsConfirmedAt).not.toBeNull();
    const [entry] = await db
      .select()
      .from(schema.auditLog)
      .where(and(eq(schema.auditLog.caseId, c.case!.id), eq(schema.auditLog.action, 'checklist.confirmed')));
    expect(entry).toMatchObject({ actorId: c.user.id, after: { prefilled: ['about.addressLine1', 'about.town', 'about.postcode'] } });
    // Again: nothing left to confirm there, nothing changes.
    const again = await confirm(c, { paths: ['about.fullName'] });
    expect(again.status).toBe(200);
    expect((await rowOf(c)).version).toBe(after.version);
  });

  it('an answer of the customer’s own takes a detail off the list; the address columns keep what the save did not send', async () => {
    const c = await newCustomer({ addressLine1: '3 Mill Lane', town: 'Quillbury', postcode: 'AB12 7EF', fromInvitation: true });
    expect((await patch(c, { about: { town: 'Quillbury Green' } })).status).toBe(200);
    const row = await rowOf(c);
    expect(row.prefilled).not.toContain('about.town');
    expect(row.prefilled).toContain('about.postcode');
    expect(row).toMatchObject({ town: 'Quillbury Green', addressLine1: '3 Mill Lane', postcode: 'AB12 7EF' });
    expect((await patch(c, { about: { fullName: 'Test Customer-Reyes' } })).status).toBe(200);
    expect(await rowOf(c)).toMatchObject({ town: 'Quillbury Green', addressLine1: '3 Mill Lane', postcode: 'AB12 7EF' });
  });

  it('refuses a body that names no detail or one the invitation cannot fill, changing nothing', async () => {
    const c = await newCustomer({ addressLine1: '3 Mill Lane', fromInvitation: true });
    const before = await rowOf(c);
    for (const body of [{}, { paths: [] }, { paths: ['about.tenure'] }, { paths: ['about.fullName'], extra: true }]) {
      const r = await confirm(c, body);
      expect(r.status, JSON.stringify(body)).toBe(422);
      expect(r.body.error.code).toBe('invalid');
      expect(Object.keys(r.body.error.fields).length).toBeGreaterThan(0);
    }
    expect(await rowOf(c)).toMatchObject({ version: before.version, prefilled: before.prefilled });
  });

  it('answers 404 for someone else’s case and 409 once the case is closed for changes', async () => {
    const c = await newCustomer({ fromInvitation: true });
    const other = await newCustomer({});
    const r = await other.client.json(`/api/cases/${c.case!.id}/confirm-details`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ paths: ['about.fullName'] }) });
    expect(r.status).toBe(404);
    await db.update(schema.cases).set({ stage: 'survey_booked' }).where(eq(schema.cases.id, c.case!.id));
    const locked = await confirm(c, { paths: ['about.fullName'] });
    expect(locked.status).toBe(409);
    expect((await rowOf(c)).prefilled).toContain('about.fullName');
  });
});
