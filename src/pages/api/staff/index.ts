import { api, json, parseJsonBody } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { inviteStaff, listStaff } from '@/lib/server/staff.server';
import { staffInviteSchema } from '@/lib/schemas/office';

/** GET /api/staff — every admin and surveyor (admin). */
export const GET = api(async (ctx) => {
  requireRole(ctx, 'admin');
  return json({ items: await listStaff() });
});

/** POST /api/staff — invite a member of staff; they get a set-your-password link (admin). */
export const POST = api(async (ctx) => {
  const admin = requireRole(ctx, 'admin');
  const body = await parseJsonBody(ctx.request, staffInviteSchema);
  const user = await inviteStaff(admin, body);
  return json({ id: user.id, name: user.name, email: user.email, role: user.role, active: user.active }, 201);
});
