// Server-only: computes a case's readiness from its answers and uploads, and stores the result
// on the case so the office queue can filter and sort by it without recomputing.
import { eq, notInArray } from 'drizzle-orm';
import { cases, surveyOutcomes, uploads, type CaseRow } from '../../db/schema';
import { runChecks, type ChecklistAnswers, type ReadinessResult, type ReadinessSettings, type UploadSummary } from '../readiness';
import { lightRank } from '../readiness/lights';
import { markConfirmedOnSite, withSiteFindings, type SiteFindings } from '../schemas/outcome';
import { db } from './db.server';
import { refreshSearchTextSql } from '../../db/search-text';
import { RECOMPUTE_QUEUE } from './jobs.server';
import { readinessSettings, todayInGb } from './settings.server';
import type PgBoss from 'pg-boss';

type Tx = Parameters<Parameters<ReturnType<typeof db>['transaction']>[0]>[0];
type Conn = Tx | ReturnType<typeof db>;


export async function uploadSummaries(caseId: string, conn: Conn = db()): Promise<UploadSummary[]> {
  return conn.select({ kind: uploads.kind, status: uploads.status, reason: uploads.reason }).from(uploads).where(eq(uploads.caseId, caseId));
}

/** What the survey confirmed on site, if an outcome has been recorded. */
export async function siteFindings(caseId: string, conn: Conn = db()): Promise<SiteFindings | null> {
  const [found] = await conn
    .select({ confirmedEarthing: surveyOutcomes.confirmedEarthing, confirmedFuseAmps: surveyOutcomes.confirmedFuseAmps })
    .from(surveyOutcomes)
    .where(eq(surveyOutcomes.caseId, caseId));
  return found ? (found as SiteFindings) : null;
}

/**
 * Readiness for one case as it stands in the database now. Values the surveyor confirmed on
 * site replace the customer's answers, and the checks resting on them are marked confirmedOnSite.
 */
export async function computeReadiness(
  row: Pick<CaseRow, 'id' | 'checklist'>,
  conn: Conn = db(),
  known?: ReadinessSettings,
): Promise<ReadinessResult> {
  const [summaries, settings, findings] = await Promise.all([uploadSummaries(row.id, conn), known ?? readinessSettings(conn), siteFindings(row.id, conn)]);
  const answers = withSiteFindings(row.checklist as ChecklistAnswers, findings);
  const result = runChecks({ answers, uploads: summaries, settings, today: todayInGb() });
  return { ...result, checks: markConfirmedOnSite(result.checks, findings) };
}

/**
 * Recomputes and stores the readiness of one case; call it inside the transaction that changed
 * the answers or uploads so the stored light never disagrees with them.
 */
export async function refreshReadiness(caseId: string, conn: Conn = db(), settings?: ReadinessSettings): Promise<ReadinessResult | undefined> {
  const [row] = await conn.select({ id: cases.id, checklist: cases.checklist }).from(cases).where(eq(cases.id, caseId));
  if (!row) return undefined;
  const result = await computeReadiness(row, conn, settings);
  await conn
    .update(cases)
    .set({
      readinessLight: result.light,
      readinessRank: lightRank[result.light],
      readinessGaps: result.gapCount,
      readinessChecks: result.checks,
      readinessAt: new Date(),
    })
    .where(eq(cases.id, caseId));
  await conn.execute(refreshSearchTextSql(caseId));
  return result;
}

/** After a settings change or a new day: recompute every open case. */
export async function refreshAllOpenCases(): Promise<number> {
  const ids = await db()
    .select({ id: cases.id })
    .from(cases)
    .where(notInArray(cases.stage, ['surveyed', 'withdrawn']));
  // Read the settings once for the whole batch, not once per case.
  const settings = await readinessSettings();
  for (const { id } of ids) await refreshReadiness(id, db(), settings);
  return ids.length;
}

/**
 * The worker's side of queueReadinessRecompute: each job recomputes every open case with the
 * settings as they are when it runs.
 * @example await workReadinessRecompute(boss)
 */
export async function workReadinessRecompute(boss: PgBoss): Promise<void> {
  await boss.work(RECOMPUTE_QUEUE, async () => {
    await refreshAllOpenCases();
  });
}
