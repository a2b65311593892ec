// Server-only: one PostgreSQL pool for the process, shared by every query module.
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import * as schema from '../../db/schema';
import { config } from './config.server';

type Db = ReturnType<typeof drizzle<typeof schema>>;

let client: postgres.Sql | undefined;
let instance: Db | undefined;

/** The Drizzle database, connected on first use. */
export function db(): Db {
  if (!instance) {
    // Behind a transaction-mode pooler (PgBouncer and the like) each transaction may land on a
    // different server connection, so named prepared statements must be off (docs/deploy.md).
    client = postgres(config.databaseUrl, { max: config.databasePoolSize, prepare: config.databasePrepare, onnotice: () => {} });
    instance = drizzle(client, { schema });
  }
  return instance;
}

/** The raw postgres.js client, for health checks and hand-written SQL. */
export function sqlClient(): postgres.Sql {
  db();
  return client!;
}
