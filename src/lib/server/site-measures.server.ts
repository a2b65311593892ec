// Server-only: what the office or the surveyor records about a case that no customer answer can
// supply — a measured maximum demand, the 722.411.4.1 earthing measure, RA and IΔn. One
// transaction saves it with its audit entry and recomputes the readiness that reads it.
import { eq } from 'drizzle-orm';
import { cases, type CaseRow } from '@/db/schema';
import { mergeSiteMeasures, readSiteMeasures, type SiteMeasuresBody } from '@/lib/schemas/outcome';
import type { SiteMeasures } from '@/lib/readiness';
import { audit } from './audit.server';
import { toCaseView, type CaseView } from './case-view.server';
import { transaction } from './db.server';
import { HttpError } from './http';
import { readinessSettings } from './settings.server';
import { refreshReadiness } from './readiness.server';
import type { SessionUser } from './users.server';

/**
 * Records site measures over the saved ones (null clears one) and recomputes the case's readiness.
 *
 * @example const { siteMeasures } = await recordSiteMeasures(admin, row, { measuredMaxDemandAmps: 38 });
 */
export async function recordSiteMeasures(actor: SessionUser, row: CaseRow, body: SiteMeasuresBody): Promise<{ case: CaseView; siteMeasures: SiteMeasures }> {
  // Read before the transaction opens, so every query inside it goes through the transaction.
  const settings = await readinessSettings();
  const saved = await transaction(async (tx) => {
    const [current] = await tx.select().from(cases).where(eq(cases.id, row.id)).for('update');
    if (!current) throw new HttpError(404, 'not_found', 'That case was not found.');
    const before = readSiteMeasures(current.siteMeasures);
    const after = mergeSiteMeasures(before, body);
    await tx.update(cases).set({ siteMeasures: after, updatedAt: new Date() }).where(eq(cases.id, row.id));
    await audit(tx, { caseId: row.id, actorId: actor.id, action: 'site_measures.recorded', entity: 'case', entityId: row.id, before, after });
    await refreshReadiness(tx, row.id, settings);
    const [fresh] = await tx.select().from(cases).where(eq(cases.id, row.id));
    return fresh!;
  });
  return { case: toCaseView(saved, actor.role), siteMeasures: readSiteMeasures(saved.siteMeasures) };
}
