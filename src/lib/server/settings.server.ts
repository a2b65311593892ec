// Server-only: the settings table — readiness thresholds and reminder schedule — with defaults.
import { eq } from 'drizzle-orm';
import { settings } from '@/db/schema';
import { resolveReadinessSettings, type ReadinessSettings } from '@/lib/readiness';
import { reminderSettingsSchema, type ReminderSettings } from '@/lib/schemas/settings';
import { db } from './db.server';

/** The database or an open transaction: anything that can run a select. */
type Conn = Pick<ReturnType<typeof db>, 'select'>;

async function readSetting(key: string, conn: Conn = db()): Promise<unknown> {
  const [row] = await conn.select().from(settings).where(eq(settings.key, key)).limit(1);
  return row?.value ?? null;
}

/**
 * Saved readiness settings over the documented defaults. Inside a transaction pass it: a second
 * pool connection per transaction deadlocks once every connection holds one (ten saves at once).
 */
export async function readinessSettings(conn: Conn = db()): Promise<ReadinessSettings> {
  const saved = await readSetting('readiness', conn);
  try {
    return resolveReadinessSettings((saved ?? {}) as Record<string, unknown>);
  } catch {
    // A stored value that no longer fits the schema must not stop every case: use defaults.
    return resolveReadinessSettings({});
  }
}

export async function reminderSettings(): Promise<ReminderSettings> {
  const parsed = reminderSettingsSchema.safeParse((await readSetting('reminders')) ?? {});
  return parsed.success ? parsed.data : reminderSettingsSchema.parse({});
}

export async function saveSetting(key: string, value: unknown, actorId: string) {
  await db()
    .insert(settings)
    .values({ key, value, updatedBy: actorId, updatedAt: new Date() })
    .onConflictDoUpdate({ target: settings.key, set: { value, updatedBy: actorId, updatedAt: new Date() } });
}

/** Today's date in Great Britain, YYYY-MM-DD: the date the timing check counts from. */
export function todayInGb(now = new Date()): string {
  return new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London', year: 'numeric', month: '2-digit', day: '2-digit' }).format(now);
}

/** The hour in Great Britain, 0–23, so "never at night" means night at the customer's home. */
export function hourInGb(now: Date): number {
  return Number(new Intl.DateTimeFormat('en-GB', { timeZone: 'Europe/London', hour: '2-digit', hourCycle: 'h23' }).format(now));
}
