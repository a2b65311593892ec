import { api, json, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { setStaffActive } from '@/lib/server/staff.server';
import { staffUpdateSchema } from '@/lib/schemas/office';

/** PATCH /api/staff/:id — deactivate or reactivate an account (admin). */
export const PATCH = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const { active } = await parseJsonBody(ctx.request, staffUpdateSchema);
  return json(await setStaffActive(admin, ctx.params.id!, active));
});
