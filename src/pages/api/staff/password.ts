import { z } from 'zod';
import { api, json, parseJsonBody } from '@/lib/server/http';
import { setPasswordWithToken } from '@/lib/server/staff.server';
import { setPasswordSchema } from '@/lib/schemas/office';

const bodySchema = setPasswordSchema.extend({ email: z.string().email('Not an e-mail address.'), token: z.string().regex(/^[0-9a-f]{64}$/, 'Not a valid link.') });

/** POST /api/staff/password — set a password with the one-time link from the staff invitation. */
export const POST = api(async (ctx) => {
  const { email, token, password } = await parseJsonBody(ctx.request, bodySchema);
  await setPasswordWithToken(email, token, password);
  return json({ ok: true });
});
