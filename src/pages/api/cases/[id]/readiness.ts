import { api, json, notFound } from '@/lib/server/http';
import { requireUser } from '@/lib/server/auth';
import { findVisibleCase } from '@/lib/server/cases.server';
import { db } from '@/lib/server/db.server';
import { checksFor } from '@/lib/server/case-view.server';
import { computeReadiness } from '@/lib/server/readiness.server';
import { readinessSettings } from '@/lib/server/settings.server';

/** GET /api/cases/:id/readiness — every check with its light, reason and source; figures and trade words for staff only. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  const row = await findVisibleCase(user, ctx.params.id!);
  if (!row) throw notFound('That case');
  // Computed fresh: the timing check depends on today's date, not only on the last save.
  const { light, gapCount, checks } = await computeReadiness(db(), row, await readinessSettings());
  return json({ light, gapCount, checks: checksFor(checks, user.role) });
});
