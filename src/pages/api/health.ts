import type { APIContext } from 'astro';
import { json } from '@/lib/server/http';
import { sqlClient } from '@/lib/server/db.server';

/** GET /api/health — is the app up, and can it reach PostgreSQL? */
export async function GET(_ctx: APIContext): Promise<Response> {
  try {
    await Promise.race([
      sqlClient()`select 1`,
      new Promise((_, reject) => setTimeout(() => reject(new Error('timeout')), 3000)),
    ]);
    return json({ ok: true, db: 'up' });
  } catch {
    return json({ ok: false, db: 'down' }, 503);
  }
}
