import { api, json } from '@/lib/server/http';
import { requireRole } from '@/lib/server/auth';
import { audit } from '@/lib/server/audit.server';
import { db } from '@/lib/server/db.server';
import { endAllSessions } from '@/lib/server/sessions.server';

/** POST /api/me/sign-out-everywhere — staff end every session of their account, on every device. */
export const POST = api(async (ctx) => {
  const user = requireRole(ctx, 'admin', 'surveyor');
  await endAllSessions(user.id);
  await audit(db(), { actorId: user.id, action: 'user.signed_out_everywhere', entity: 'user', entityId: user.id });
  return json({ signedOut: true });
});
