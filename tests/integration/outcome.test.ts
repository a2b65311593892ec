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
// - headroom: 10 A baseline (settings, common practice) + 32 A charger at full load (Regulation 722.311)
//   = 42 A against 60 A leaves 18 A, but a 60 A cut-out is at least amber (common practice: 60 A often
//   needs an upgrade).
const checklist = {
  supply: { mpanCore: '1312345678907', mainFuseAmps: 60, looped: 'no', earthing: 'pme', loads: { showerKw: 0, cooker: false, immersion: false, heatPumpKw: 0, storageHeaters: 0, otherEvCharger: false, solarPv: false } },
  charger: { cableRunMetres: 8, route: 'through-wall', softGround: false, preference: 'socketed' },
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
      measurements: { zeOhms: 21, electrodeOhms: 85, supplyVolts: 238.5 },
      notes: 'TT with an existing rod; move the charge point 1 m left of the door.',
    });
    expect(r.status).toBe(200);
    expect(r.body.case.stage).toBe('surveyed');
    expect(r.body.officeTold).toBe(true);

    const [saved] = await db.select().from(schema.surveyOutcomes).where(eq(schema.surveyOutcomes.caseId, c.id));
    expect(saved).toMatchObject({ outcome: 'go_ahead_with_changes', confirmedEarthing: 'tt', confirmedFuseAmps: 100, surveyorId, measurements: { zeOhms: 21, electrodeOhms: 85, supplyVolts: 238.5 } });

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
    // - TT earthing: an installation earth electrode exists, so the 722.411.4.1 PME restriction does not
    //   apply (BS 7671 Regulation 722.411.4.1; RA × IΔn ≤ 50 V to be tested, 411.5.3): green.
    // - 100 A cut-out: 42 A demand leaves 58 A headroom, above the margin, and 100 A is not a small fuse: green.
    const after = await surveyor.json(`/api/cases/${c.id}/readiness`);
    const earthing = checkOf(after.body.checks, 'earthing');
    expect(earthing).toMatchObject({ light: 'green', confirmedOnSite: true });
    expect(earthing.staffText).toContain('Earthing TT (confirmed on site).');
    const headroom = checkOf(after.body.checks, 'supply-headroom');
    expect(headroom).toMatchObject({ light: 'green', confirmedOnSite: true });
    expect(headroom.staffText).toContain('100 A cut-out fuse (confirmed on site).');
    expect(headroom.staffText).toContain('headroom 58 A');
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
