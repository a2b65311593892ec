// Server-only: recording the survey outcome. One transaction saves what the surveyor found,
// moves the case to Surveyed with its audit entries and restores the checks with the confirmed
// values; then the office is told by e-mail.
import { and, eq } from 'drizzle-orm';
import { cases, surveyOutcomes, type CaseRow } from '@/db/schema';
import { earthingLabels, earthingMeasureOptionLabels, measurementFields, measurementIds, mergeSiteMeasures, outcomeLabels, outcomeSiteMeasures, readSiteMeasures, type OutcomeBody } from '@/lib/schemas/outcome';
import { stageLabels, type StageId } from '@/lib/stages';
import { audit } from './audit.server';
import { sendCaseMail } from './case-mail.server';
import { toCaseView, type CaseView } from './case-view.server';
import { config } from './config.server';
import { transaction } from './db.server';
import { surveyRecordedEmail } from './email-templates.server';
import { HttpError } from './http';
import { firm } from './office.server';
import { refreshReadiness } from './readiness.server';
import { readinessSettings } from './settings.server';
import type { SessionUser } from './users.server';

/** An outcome can be recorded only while the survey is booked. */
export const outcomeStage: StageId = 'survey_booked';

/**
 * Saves the outcome, moves the case from Survey booked to Surveyed and e-mails the office.
 * 409 from any other stage (or when another save got there first).
 *
 * @example const { case: view } = await recordOutcome(surveyor, row, { outcome: 'go_ahead', confirmedEarthing: 'tns', confirmedFuseAmps: 100, measurements: {}, notes: undefined });
 */
export async function recordOutcome(actor: SessionUser, row: CaseRow, body: OutcomeBody): Promise<{ case: CaseView; officeTold: boolean }> {
  if (row.stage !== outcomeStage) {
    throw new HttpError(409, 'conflict', `The outcome is recorded while the survey is booked; this case is ${stageLabels[row.stage as StageId]}.`, undefined, { stage: row.stage });
  }
  // Read before the transaction opens: inside it, every query must go through tx.
  const settings = await readinessSettings();
  const saved = await transaction(async (tx) => {
    const [moved] = await tx
      .update(cases)
      .set({ stage: 'surveyed', updatedAt: new Date() })
      .where(and(eq(cases.id, row.id), eq(cases.stage, outcomeStage)))
      .returning();
    if (!moved) throw new HttpError(409, 'conflict', 'The case moved while you were recording the visit. Reload and check it.', undefined, { stage: null });
    const values = {
      outcome: body.outcome,
      earthingMeasure: body.earthingMeasure,
      confirmedEarthing: body.confirmedEarthing,
      confirmedFuseAmps: body.confirmedFuseAmps,
      measurements: body.measurements,
      notes: body.notes ?? null,
      surveyorId: actor.id,
      recordedAt: new Date(),
    };
    await tx.insert(surveyOutcomes).values({ caseId: row.id, ...values }).onConflictDoUpdate({ target: surveyOutcomes.caseId, set: values });
    // The measure, RA, IΔn and any measured demand feed the checks through the case's site measures.
    const found = outcomeSiteMeasures(body);
    if (Object.keys(found).length > 0) {
      await tx.update(cases).set({ siteMeasures: mergeSiteMeasures(readSiteMeasures(moved.siteMeasures), found) }).where(eq(cases.id, row.id));
    }
    await audit(tx, { caseId: row.id, actorId: actor.id, action: 'stage.changed', entity: 'case', entityId: row.id, before: { stage: outcomeStage }, after: { stage: 'surveyed', outcome: body.outcome } });
    await audit(tx, { caseId: row.id, actorId: actor.id, action: 'survey.recorded', entity: 'survey_outcome', entityId: row.id, after: { ...values, recordedAt: values.recordedAt.toISOString() } });
    // The checks now read the confirmed earthing and fuse in place of the customer's answers.
    await refreshReadiness(tx, row.id, settings);
    const [fresh] = await tx.select().from(cases).where(eq(cases.id, row.id));
    return fresh!;
  });
  const officeTold = await tellOffice(actor, saved, body);
  return { case: toCaseView(saved, actor.role), officeTold };
}

/** E-mails the office; a mail failure is logged and reported, but the record stands. */
async function tellOffice(actor: SessionUser, row: CaseRow, body: OutcomeBody): Promise<boolean> {
  try {
    const office = await firm();
    await sendCaseMail({ caseId: row.id, kind: 'outcome', sentById: actor.id, mail: { to: office.email, ...outcomeEmail(actor, row, body) } });
    return true;
  } catch (err) {
    console.error('survey outcome e-mail to the office failed', err);
    return false;
  }
}

/**
 * The office's e-mail about a recorded survey: the outcome, what was confirmed and measured, the notes.
 *
 * @example outcomeEmail(surveyor, row, body).subject // 'Survey recorded for GW-7K2Q: Go ahead'
 */
export function outcomeEmail(actor: SessionUser, row: CaseRow, body: OutcomeBody) {
  const address = [row.addressLine1, row.town, row.postcode].filter(Boolean).join(', ') || 'address not given';
  const found = [
    `Outcome: ${outcomeLabels[body.outcome]}`,
    `Earthing: ${body.confirmedEarthing ? `${earthingLabels[body.confirmedEarthing]} (confirmed on site)` : 'not confirmed'}`,
    `Main fuse: ${body.confirmedFuseAmps ? `${body.confirmedFuseAmps} A (confirmed on site)` : 'not confirmed'}`,
    ...(body.earthingMeasure ? [`722.411.4.1 measure: ${earthingMeasureOptionLabels[body.earthingMeasure]}`] : []),
    ...measurementIds
      .filter((id) => typeof body.measurements[id] === 'number')
      .map((id) => `${measurementFields[id].label}: ${body.measurements[id]} ${measurementFields[id].unit}`),
  ];
  return surveyRecordedEmail({
    surveyorName: actor.name ?? null,
    reference: row.reference,
    address,
    outcome: outcomeLabels[body.outcome],
    found,
    notes: body.notes || null,
    url: `${config.appUrl}/office/cases/${row.id}`,
  });
}
