import { api, json, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { readinessSettings, reminderSettings, saveSetting } from '@/lib/server/settings.server';
import { queueReadinessRecompute } from '@/lib/server/jobs.server';
import { audit } from '@/lib/server/audit.server';
import { db } from '@/lib/server/db.server';
import { settingsUpdateSchema } from '@/lib/schemas/settings';
import { defaultReadinessSettings, settingDescriptions } from '@/lib/readiness';

async function current() {
  return { readiness: await readinessSettings(), reminders: await reminderSettings(), defaults: defaultReadinessSettings, descriptions: settingDescriptions };
}

/** GET /api/settings — readiness thresholds and reminder schedule, with defaults and meanings (admin). */
export const GET = api(async (ctx) => {
  requireRole(ctx, 'admin');
  return json(await current());
});

/** PUT /api/settings — change any setting; a readiness change queues a recompute of every open case (admin). */
export const PUT = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const body = await parseJsonBody(ctx.request, settingsUpdateSchema);
  const before = await current();
  if (body.readiness) await saveSetting('readiness', { ...before.readiness, ...body.readiness }, admin.id);
  if (body.reminders) await saveSetting('reminders', body.reminders, admin.id);
  await audit(db(), { actorId: admin.id, action: 'settings.updated', entity: 'settings', before: { readiness: before.readiness, reminders: before.reminders }, after: body });
  // The worker recomputes in the background: a request never loops over every case.
  const recomputeQueued = body.readiness ? (await queueReadinessRecompute(), true) : false;
  return json({ ...(await current()), recomputeQueued });
});
