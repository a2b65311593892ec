// Direct database access for arranging test data through the shared factories.
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import * as schema from '../../src/db/schema';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('DATAAPP_URL is not set: run integration tests through `npm test`.');

export const sql = postgres(url, { max: 3, onnotice: () => {} });
export const db = drizzle(sql, { schema });
export { schema };
