// Server-only: the installer firm's own details, from settings (falling back to the environment).
import { eq } from 'drizzle-orm';
import { settings } from '@/db/schema';
import { config } from './config.server';
import { db } from './db.server';

export type Firm = { name: string; email: string; phone?: string };

export async function firm(): Promise<Firm> {
  const [row] = await db().select().from(settings).where(eq(settings.key, 'firm')).limit(1);
  const value = (row?.value ?? {}) as Partial<Firm>;
  return { name: value.name ?? 'Your installer', email: value.email ?? config.officeEmail, phone: value.phone };
}
