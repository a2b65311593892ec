// Seeds the demo scenario. With SEED_ONLY_IF_EMPTY=1 (as `npm start` runs it) an existing
// database is left alone, so a second start keeps your data.
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import { sql } from 'drizzle-orm';
import { seedDemo } from './demo';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATABASE_URL is not set: run `npm start`, which sets it.');
const client = postgres(url, { max: 1, onnotice: () => {} });
const db = drizzle(client);
try {
  const [row] = await db.execute<{ n: number }>(sql`select count(*)::int as n from users`);
  if (process.env.SEED_ONLY_IF_EMPTY === '1' && Number(row?.n) > 0) {
    console.log('[groundwork] Database already has data: not seeding.');
  } else {
    await seedDemo(db, process.env.DEMO_PASSWORD ?? 'groundwork-demo');
    console.log('[groundwork] Demo data seeded.');
  }
} finally {
  await client.end();
}
