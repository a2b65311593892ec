import { api, json } from '../../../lib/server/http';
import { requireUser } from '../../../lib/server/auth';
import { listAllCases, listAssignedCases, listCustomerCases } from '../../../lib/server/cases.server';

/** GET /api/cases — a customer's own cases; for staff, the cases they may work on. */
export const GET = api(async (ctx) => {
  const user = requireUser(ctx);
  if (user.role === 'customer') {
    const items = await listCustomerCases(user);
    return json({ items, total: items.length });
  }
  if (user.role === 'surveyor') {
    const items = await listAssignedCases(user);
    return json({ items, total: items.length, page: 1, pageSize: items.length });
  }
  const pageSize = 50;
  const page = Math.max(1, Number(ctx.url.searchParams.get('page') ?? 1) || 1);
  const { items, total } = await listAllCases({ limit: pageSize, offset: (page - 1) * pageSize });
  return json({ items, total, page, pageSize });
});
