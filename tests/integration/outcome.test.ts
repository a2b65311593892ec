// Recording the survey outcome: the shared schema's 422s, who may record it, the move to
// Surveyed with its audit trail and e-mail, and the confirmed values flowing back into the checks.
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { Client } from '../helpers/http';
import { db, schema } from '../helpers/db';
import { messagesTo } from '../helpers/mail';
import { newCustomer, newStaff } from '../helpers/people';
import { createCase, createUser } from '../../seeds/factories';

let admin: Client;
let surveyor: Client;
let surveyorId: string;
let otherSurveyor: Client;

beforeAll(async () => {
  const [a, s, o] = await Promise.all([newStaff('admin'), newStaff('surveyor'), newStaff('surveyor')]);
  admin = a.client;
  surveyor = s.client;
  surveyorId = s.user.id;
  otherSurveyor = o.client;
});

// The customer said PME with no open soil near the charge point, and a 60 A cut-out, with no big loads:
// - earthing: PME without a nearby electrode is amber (BS 7671:2018+A2:2022 Regulation 722.411.4.1);
// - headroom (IET On-Site Guide Table A2, second-hand via The Electrician's Guide Table 6.2): one
//   socket circuit 32 A + lighting 66% × 2000 / 230 = 5.74 A + a 3.6 kW charger at 16 A (Regulation
//   722.311) = 53.74 A against 60 A leaves 6.26 A, under the 10 A margin: amber.
const checklist = {
  supply: { mpanCore: '1312345678907', mainFuseAmps: 60, looped: 'no', earthing: 'pme', phases: 'single', loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false, socketCircuits: 1 } },
  charger: { cableRunMetres: 8, route: 'through-wall', softGround: false, preference: 'socketed', ratingKw: 3.6 },
  parking: { kind: 'attached-drive', cars: 1, habit: 'nose-in' },
};

async function bookedCase(stage: 'survey_booked' | 'ready_for_survey' = 'survey_booked') {
  const customer = await createUser(db, { role: 'customer', name: 'Outcome Customer' });
  return createCase(db, { customerId: customer.id, stage, checklist, surveyorId, surveyDate: '2099-04-01', addressLine1: '3 Ropewalk', town: 'Quillbury', postcode: 'AB12 7EF' });
}

const post = (client: Client, id: string, body: unknown) => client.send('POST', `/api/cases/${id}/outcome`, body);
const checkOf = (checks: { id: string }[], id: string) => checks.find((c) => c.id === id) as { id: string; light: string; staffText: string; confirmedOnSite?: boolean };

describe('POST /api/cases/:id/outcome — validation', () => {
  it('answers 422 naming each bad field, and needs notes unless it is a plain go-ahead', async () => {
    const c = await bookedCase();
    const bad = await post(surveyor, c.id, {
      outcome: 'maybe',
      confirmedEarthing: 'tn-c',
      confirmedFuseAmps: 75,
      // Ze and PFC outside the form's sanity ranges (0–200 Ω, 0–25 kA; common practice, no published source).
      measurements: { zeOhms: -0.1, pfcKa: 99, unknownReading: 1 },
      extra: true,
    });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(
      ['confirmedEarthing', 'confirmedFuseAmps', 'extra', 'measurements.pfcKa', 'measurements.unknownReading', 'measurements.zeOhms', 'outcome'].sort(),
    );
    const noNotes = await post(surveyor, c.id, { outcome: 'cannot_install', confirmedEarthing: null, confirmedFuseAmps: null });
    expect(noNotes.status).toBe(422);
    expect(Object.keys(noNotes.body.error.fields)).toEqual(['notes']);
    const shortNotes = await post(surveyor, c.id, { outcome: 'go_ahead_with_changes', notes: 'move it' });
    expect(shortNotes.status).toBe(422);
    expect(shortNotes.body.error.fields.notes).toContain('at least 10 characters');
    // Nothing was saved by the refusals.
    expect((await db.select().from(schema.cases).where(eq(schema.cases.id, c.id)))[0]!.stage).toBe('survey_booked');
    expect(await db.select().from(schema.surveyOutcomes).where(eq(schema.surveyOutcomes.caseId, c.id))).toHaveLength(0);
  });

  it('is for the assigned surveyor or the office: another surveyor 404, a customer 403, anonymous 401', async () => {
    const c = await bookedCase();
    const body = { outcome: 'go_ahead' };
    expect((await post(otherSurveyor, c.id, body)).status).toBe(404);
    const { client: customer } = await newCustomer({});
    expect((await post(customer, c.id, body)).status).toBe(403);
    expect((await post(new Client(), c.id, body)).status).toBe(401);
  });

  it('is refused with 409 unless the survey is booked', async () => {
    const c = await bookedCase('ready_for_survey');
    const r = await post(admin, c.id, { outcome: 'go_ahead' });
    expect(r.status).toBe(409);
    expect(r.body.error.stage).toBe('ready_for_survey');
  });
});

describe('POST /api/cases/:id/outcome — recording the visit', () => {
  it('saves the outcome, moves the case to Surveyed with audit entries, e-mails the office, and confirms values in the checks', async () => {
    const c = await bookedCase();
    const before = await surveyor.json(`/api/cases/${c.id}/readiness`);
    expect(checkOf(before.body.checks, 'earthing').light).toBe('amber');
    expect(checkOf(before.body.checks, 'supply-headroom').light).toBe('amber');
    const officeMailBefore = (await messagesTo('office@example.com')).length;

    const r = await post(surveyor, c.id, {
      outcome: 'go_ahead_with_changes',
      confirmedEarthing: 'tt',
      confirmedFuseAmps: 100,
      measurements: { zeOhms: 21, electrodeOhms: 85, rcdIdnMilliamps: 30, supplyVolts: 238.5 },
      notes: 'TT with an existing rod; move the charge point 1 m left of the door.',
    });
    expect(r.status).toBe(200);
    expect(r.body.case.stage).toBe('surveyed');
    expect(r.body.officeTold).toBe(true);

    const [saved] = await db.select().from(schema.surveyOutcomes).where(eq(schema.surveyOutcomes.caseId, c.id));
    expect(saved).toMatchObject({ outcome: 'go_ahead_with_changes', confirmedEarthing: 'tt', confirmedFuseAmps: 100, surveyorId, measurements: { zeOhms: 21, electrodeOhms: 85, rcdIdnMilliamps: 30, supplyVolts: 238.5 } });

    const log = (await admin.json(`/api/cases/${c.id}/audit`)).body.items as { action: string; before: any; after: any; actorId: string }[];
    const moved = log.find((e) => e.action === 'stage.changed');
    expect(moved).toMatchObject({ before: { stage: 'survey_booked' }, after: { stage: 'surveyed' }, actorId: surveyorId });
    expect(log.find((e) => e.action === 'survey.recorded')?.after).toMatchObject({ outcome: 'go_ahead_with_changes', confirmedEarthing: 'tt' });

    // The office hears of it (firm e-mail from the demo settings).
    const officeMail = await messagesTo('office@example.com');
    const ours = officeMail.slice(officeMailBefore).find((m) => m.subject.includes(c.reference));
    expect(ours?.subject).toBe(`Survey recorded for ${c.reference}: Go ahead with changes`);
    expect(ours?.text).toContain('Earthing: TT (confirmed on site)');
    expect(ours?.text).toContain('move the charge point 1 m left');

    // Confirmed values replace the customer's answers:
    // - TT earthing: the 722.411.4.1 PME restriction does not apply; RA 85 Ω × IΔn 30 mA = 2.55 V ≤ 50 V
    //   (BS 7671 411.5.3) and 85 Ω ≤ 200 Ω: green.
    // - 100 A cut-out: 53.74 A demand leaves 46.26 A headroom, above the margin, and 100 A is not a small fuse: green.
    const after = await surveyor.json(`/api/cases/${c.id}/readiness`);
    const earthing = checkOf(after.body.checks, 'earthing');
    expect(earthing).toMatchObject({ light: 'green', confirmedOnSite: true });
    expect(earthing.staffText).toContain('Earthing TT (confirmed on site).');
    const headroom = checkOf(after.body.checks, 'supply-headroom');
    expect(headroom).toMatchObject({ light: 'green', confirmedOnSite: true });
    expect(headroom.staffText).toContain('100 A cut-out fuse (confirmed on site).');
    expect(headroom.staffText).toContain('Headroom on the 100 A cut-out 46.26 A');
    expect(earthing.staffText).toContain('RA 85 Ω × IΔn 30 mA = 2.55 V');
    // RA and IΔn went into the case's site measures, where the checks read them.
    const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, c.id));
    expect(row!.siteMeasures).toEqual({ electrodeOhms: 85, rcdIdnMilliamps: 30 });
    expect(checkOf(after.body.checks, 'parking').confirmedOnSite).toBeUndefined();
    // The stored readiness (what the office queue and case page read) says the same.
    const view = (await admin.json(`/api/cases/${c.id}`)).body;
    expect(checkOf(view.readiness.checks, 'earthing').confirmedOnSite).toBe(true);
    // The customer's own answers are kept as they gave them.
    expect(view.checklist.supply).toMatchObject({ earthing: 'pme', mainFuseAmps: 60 });

    // The pack shows it as confirmed and the outcome recorded.
    const page = await surveyor.fetch(`/surveys/cases/${c.id}`);
    const html = await page.text();
    expect(html).toContain('Survey outcome: Go ahead with changes');
    expect(html).toContain('Confirmed on site: TT');

    // Once Surveyed, a second outcome is refused.
    const again = await post(surveyor, c.id, { outcome: 'go_ahead' });
    expect(again.status).toBe(409);
  });

  it('lets the office record a plain go-ahead without notes or confirmed values', async () => {
    const c = await bookedCase();
    const r = await post(admin, c.id, { outcome: 'go_ahead' });
    expect(r.status).toBe(200);
    expect(r.body.case.stage).toBe('surveyed');
    const [saved] = await db.select().from(schema.surveyOutcomes).where(eq(schema.surveyOutcomes.caseId, c.id));
    expect(saved).toMatchObject({ outcome: 'go_ahead', confirmedEarthing: null, confirmedFuseAmps: null, notes: null, measurements: {} });
    // Nothing confirmed, so no check claims to be.
    const checks = (await admin.json(`/api/cases/${c.id}/readiness`)).body.checks as { confirmedOnSite?: boolean }[];
    expect(checks.some((check) => check.confirmedOnSite)).toBe(false);
  });
});

describe('PUT /api/cases/:id/site-measures — what the office or surveyor records', () => {
  const put = (client: Client, id: string, body: unknown) => client.send('PUT', `/api/cases/${id}/site-measures`, body);

  it('a measured maximum demand replaces the Table A2 estimate, and a 722.411.4.1 measure settles PME', async () => {
    const c = await bookedCase('ready_for_survey');
    const before = (await admin.json(`/api/cases/${c.id}/readiness`)).body.checks;
    // 53.74 A estimated on 60 A: 6.26 A spare < 10 A margin → amber; PME with no measure → amber.
    expect(checkOf(before, 'supply-headroom').light).toBe('amber');
    expect(checkOf(before, 'earthing').light).toBe('amber');

    // Logger data: 12 A existing + 16 A charger = 28 A on 60 A → 32 A spare; but a 60 A cut-out is
    // at least amber (common practice). The measure: an open-PEN device → earthing green.
    const r = await put(admin, c.id, { measuredMaxDemandAmps: 12, earthingMeasure: 'open-pen-device' });
    expect(r.status).toBe(200);
    expect(r.body.siteMeasures).toEqual({ measuredMaxDemandAmps: 12, earthingMeasure: 'open-pen-device' });
    const after = (await admin.json(`/api/cases/${c.id}/readiness`)).body.checks;
    expect(checkOf(after, 'earthing').light).toBe('green');
    const headroom = checkOf(after, 'supply-headroom') as { light: string; staffText: string; figures?: unknown };
    expect(headroom.staffText).toMatch(/existing 12 A measured/);
    expect(headroom.light).toBe('amber');
    // The stored readiness agrees, and the change is in the audit trail.
    const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, c.id));
    expect(row!.readinessChecks).toEqual(expect.arrayContaining([expect.objectContaining({ id: 'earthing', light: 'green' })]));
    const log = (await admin.json(`/api/cases/${c.id}/audit`)).body.items as { action: string; after: unknown }[];
    expect(log.find((e) => e.action === 'site_measures.recorded')?.after).toEqual({ measuredMaxDemandAmps: 12, earthingMeasure: 'open-pen-device' });

    // null clears one value and leaves the other.
    const cleared = await put(surveyor, c.id, { earthingMeasure: null });
    expect(cleared.status).toBe(200);
    expect(cleared.body.siteMeasures).toEqual({ measuredMaxDemandAmps: 12 });
  });

  it('TT by the electrode test: RA 1800 Ω at 30 mA is 54 V > 50 V, red', async () => {
    const c = await bookedCase('ready_for_survey');
    await put(admin, c.id, { earthingMeasure: 'tt-electrode', electrodeOhms: 1800, rcdIdnMilliamps: 30 });
    expect(checkOf((await admin.json(`/api/cases/${c.id}/readiness`)).body.checks, 'earthing').light).toBe('red');
    await put(admin, c.id, { electrodeOhms: 100 });
    expect(checkOf((await admin.json(`/api/cases/${c.id}/readiness`)).body.checks, 'earthing').light).toBe('green');
  });

  it('refuses bad input with 422 by field and changes nothing; customers and other surveyors 404', async () => {
    const c = await bookedCase('ready_for_survey');
    const bad = await put(admin, c.id, { measuredMaxDemandAmps: -3, earthingMeasure: 'a rod somewhere' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['earthingMeasure', 'measuredMaxDemandAmps']);
    expect((await put(admin, c.id, { ohms: 3 })).status).toBe(422);
    expect((await put(admin, c.id, {})).status).toBe(422);
    const [row] = await db.select().from(schema.cases).where(eq(schema.cases.id, c.id));
    expect(row!.siteMeasures).toEqual({});
    expect((await put(otherSurveyor, c.id, { measuredMaxDemandAmps: 10 })).status).toBe(404);
    const { client: customer } = await newCustomer({});
    expect([403, 404]).toContain((await put(customer, c.id, { measuredMaxDemandAmps: 10 })).status);
    expect((await put(new Client(), c.id, { measuredMaxDemandAmps: 10 })).status).toBe(401);
  });

  it('an outcome with a measure for PME turns the earthing check green', async () => {
    const c = await bookedCase();
    const r = await post(surveyor, c.id, { outcome: 'go_ahead', earthingMeasure: 'installation-electrode', measurements: { measuredMaxDemandAmps: 20 } });
    expect(r.status).toBe(200);
    const [saved] = await db.select().from(schema.surveyOutcomes).where(eq(schema.surveyOutcomes.caseId, c.id));
    expect(saved!.earthingMeasure).toBe('installation-electrode');
    const checks = (await admin.json(`/api/cases/${c.id}/readiness`)).body.checks;
    expect(checkOf(checks, 'earthing').light).toBe('green');
  });
});
