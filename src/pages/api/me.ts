import { api, json } from '@/lib/server/http';
import { requireUser } from '@/lib/server/auth';

/** GET /api/me — the signed-in user, or 401. */
export const GET = api(async (ctx) => {
  const { id, email, name, role } = requireUser(ctx);
  return json({ id, email, name, role });
});
