// Server-only: moving a case between stages, with only the allowed moves and their conditions.
import { and, eq } from 'drizzle-orm';
import { cases, users, type CaseRow } from '@/db/schema';
import type { StageMove } from '@/lib/schemas/office';
import { allowedMoves, stageLabels, type StageId } from '@/lib/stages';
import { audit } from './audit.server';
import { clearChangesSinceReady } from './changes-since-ready.server';
import { sendCaseMail } from './case-mail.server';
import { toCaseView } from './case-view.server';
import { config } from './config.server';
import { db, transaction } from './db.server';
import { surveyBookedEmail } from './email-templates.server';
import { HttpError } from './http';
import { firm } from './office.server';
import { computeReadiness } from './readiness.server';
import { readinessSettings, todayInGb } from './settings.server';
import type { SessionUser } from './users.server';

/**
 * Moves a case, or explains why not: 409 with the allowed moves, 409 with the red checks,
 * or 422 naming the missing surveyor or date.
 */
export async function moveStage(actor: SessionUser, row: CaseRow, move: StageMove) {
  const from = row.stage as StageId;
  const allowed = allowedMoves(from);
  if (!allowed.includes(move.to)) {
    throw new HttpError(409, 'conflict', `A case that is ${stageLabels[from]} cannot move to ${stageLabels[move.to]}.`, undefined, { allowed });
  }
  const extra: Partial<CaseRow> = {};
  const note: Record<string, unknown> = {};
  if (move.to === 'ready_for_survey') {
    const readiness = await computeReadiness(db(), row, await readinessSettings());
    const reds = readiness.checks.filter((c) => c.light === 'red');
    if (reds.length > 0 && !move.overrideReason) {
      throw new HttpError(409, 'conflict', 'Checks are red: fix them, or override with a written reason.', { overrideReason: 'Needed while checks are red.' }, {
        red: reds.map((c) => ({ id: c.id, title: c.title, staffText: c.staffText })),
      });
    }
    if (reds.length > 0) Object.assign(note, { overrideReason: move.overrideReason, redChecks: reds.map((c) => c.id) });
  }
  let surveyor: { id: string; name: string | null } | undefined;
  if (move.to === 'survey_booked') {
    const fields: Record<string, string> = {};
    if (!move.surveyorId) fields.surveyorId = 'Choose a surveyor.';
    if (!move.surveyDate) fields.surveyDate = 'Choose the survey date.';
    else if (move.surveyDate < todayInGb()) fields.surveyDate = 'The survey date cannot be in the past.';
    if (move.surveyorId) {
      [surveyor] = await db()
        .select({ id: users.id, name: users.name })
        .from(users)
        .where(and(eq(users.id, move.surveyorId), eq(users.role, 'surveyor'), eq(users.active, true)));
      if (!surveyor) fields.surveyorId = 'That is not an active surveyor.';
    }
    if (Object.keys(fields).length) throw new HttpError(422, 'invalid', 'A booked survey needs a surveyor and a date.', fields);
    Object.assign(extra, { surveyorId: surveyor!.id, surveyDate: move.surveyDate! });
    Object.assign(note, { surveyorId: surveyor!.id, surveyDate: move.surveyDate });
  }
  const saved = await transaction(async (tx) => {
    const [updated] = await tx
      .update(cases)
      .set({ stage: move.to, updatedAt: new Date(), ...extra })
      .where(and(eq(cases.id, row.id), eq(cases.stage, from)))
      .returning();
    if (!updated) throw new HttpError(409, 'conflict', 'The case moved while you were looking at it. Reload and try again.', undefined, { allowed: [] });
    // Moving on means the office has looked again at whatever changed after sign-off.
    await clearChangesSinceReady(tx, row.id);
    await audit(tx, { caseId: row.id, actorId: actor.id, action: 'stage.changed', entity: 'case', entityId: row.id, before: { stage: from }, after: { stage: move.to, ...note } });
    return updated;
  });
  if (move.to === 'survey_booked') await tellCustomerSurveyBooked(actor, saved, surveyor!.name ?? 'Our surveyor');
  return toCaseView(saved, actor.role);
}

async function tellCustomerSurveyBooked(actor: SessionUser, row: CaseRow, surveyorName: string) {
  const [customer] = await db().select().from(users).where(eq(users.id, row.customerId));
  if (!customer) return;
  const office = await firm();
  await sendCaseMail({
    caseId: row.id,
    kind: 'survey_booked',
    sentById: actor.id,
    mail: {
      to: customer.email,
      ...surveyBookedEmail({ customerName: customer.name ?? '', firmName: office.name, date: row.surveyDate!, surveyorName, url: `${config.appUrl}/my` }),
    },
  });
}
