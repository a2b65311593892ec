// Direct database access for arranging test data through the shared factories.
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import * as schema from '@/db/schema';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATAAPP_URL is not set: run integration tests through `npm test`.');

export const sql = postgres(url, { max: 3, onnotice: () => {} });
export const db = drizzle(sql, { schema });
export { schema };

/**
 * Marks every other case's reminders as used up, so a reminder sweep in this test queues only
 * the cases it made. Other test files leave thousands of open cases behind (the queue tests);
 * without this, the sweep queues a send for each and the test's own wait behind them.
 * @example await reminderOnlyFor([row.id]);
 */
export async function reminderOnlyFor(caseIds: string[]): Promise<void> {
  await sql`update cases set reminders_sent = 1000 where not (id = any(${caseIds}::uuid[])) and reminders_sent < 1000`;
}
