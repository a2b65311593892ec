// Server-only: computes a case's readiness from its answers and uploads, and stores the result
// on the case so the office queue can filter and sort by it without recomputing.
import { eq, notInArray } from 'drizzle-orm';
import { cases, surveyOutcomes, uploads, type CaseRow } from '@/db/schema';
import { runChecks, type ChecklistAnswers, type ReadinessResult, type ReadinessSettings, type UploadSummary } from '@/lib/readiness';
import { lightRank } from '@/lib/readiness/lights';
import { markConfirmedOnSite, readSiteMeasures, withSiteFindings, type SiteFindings } from '@/lib/schemas/outcome';
import { db } from './db.server';
import { refreshSearchTextSql } from '@/db/search-text';
import { RECOMPUTE_QUEUE } from './jobs.server';
import { readinessSettings, todayInGb } from './settings.server';
import type PgBoss from 'pg-boss';

import type { Conn } from './db.server';

/** The case's uploads as the documents check reads them. */
export async function uploadSummaries(conn: Conn, caseId: string): Promise<UploadSummary[]> {
  return conn.select({ kind: uploads.kind, status: uploads.status, reason: uploads.reason }).from(uploads).where(eq(uploads.caseId, caseId));
}

/** What the survey confirmed on site, if an outcome has been recorded. */
export async function siteFindings(conn: Conn, caseId: string): Promise<SiteFindings | null> {
  const [found] = await conn
    .select({ confirmedEarthing: surveyOutcomes.confirmedEarthing, confirmedFuseAmps: surveyOutcomes.confirmedFuseAmps })
    .from(surveyOutcomes)
    .where(eq(surveyOutcomes.caseId, caseId));
  return found ? (found as SiteFindings) : null;
}

/**
 * Readiness for one case as it stands in the database now. Values the surveyor confirmed on
 * site replace the customer's answers, and the checks resting on them are marked confirmedOnSite;
 * what the office or surveyor recorded (site measures) goes in beside the answers.
 * Every query goes through `conn`; the settings are read by the caller (before any transaction
 * opens), so a transaction never waits for a second pool connection.
 *
 * @example const r = await computeReadiness(db(), row, await readinessSettings());
 */
export async function computeReadiness(
  conn: Conn,
  row: Pick<CaseRow, 'id' | 'checklist' | 'siteMeasures'>,
  settings: ReadinessSettings,
): Promise<ReadinessResult> {
  // One after the other: a transaction's queries share one connection anyway.
  const summaries = await uploadSummaries(conn, row.id);
  const findings = await siteFindings(conn, row.id);
  const answers = withSiteFindings(row.checklist as ChecklistAnswers, findings);
  const result = runChecks({ answers, uploads: summaries, site: readSiteMeasures(row.siteMeasures), settings, today: todayInGb() });
  return { ...result, checks: markConfirmedOnSite(result.checks, findings) };
}

/**
 * Recomputes and stores the readiness of one case; call it inside the transaction that changed
 * the answers or uploads (passing that transaction) so the stored light never disagrees with them.
 *
 * @example const settings = await readinessSettings(); await transaction((tx) => refreshReadiness(tx, id, settings));
 */
export async function refreshReadiness(conn: Conn, caseId: string, settings: ReadinessSettings): Promise<ReadinessResult | undefined> {
  const [row] = await conn.select({ id: cases.id, checklist: cases.checklist, siteMeasures: cases.siteMeasures }).from(cases).where(eq(cases.id, caseId));
  if (!row) return undefined;
  const result = await computeReadiness(conn, row, settings);
  await conn.update(cases).set(readinessColumns(result)).where(eq(cases.id, caseId));
  await conn.execute(refreshSearchTextSql(caseId));
  return result;
}

/** The stored readiness columns for a result, for an UPDATE that changes the answers too. */
export function readinessColumns(result: ReadinessResult) {
  return {
    readinessLight: result.light,
    readinessRank: lightRank[result.light],
    readinessGaps: result.gapCount,
    readinessChecks: result.checks,
    readinessAt: new Date(),
  };
}

/** After a settings change or a new day: recompute every open case. */
export async function refreshAllOpenCases(): Promise<number> {
  const ids = await db()
    .select({ id: cases.id })
    .from(cases)
    .where(notInArray(cases.stage, ['surveyed', 'withdrawn']));
  // Read the settings once for the whole batch, not once per case.
  const settings = await readinessSettings();
  for (const { id } of ids) await refreshReadiness(db(), id, settings);
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
