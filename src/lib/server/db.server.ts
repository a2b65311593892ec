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
    client = postgres(config.databaseUrl, { max: 10, onnotice: () => {} });
    instance = drizzle(client, { schema });
  }
  return instance;
}

/** The raw postgres.js client, for health checks and hand-written SQL. */
export function sqlClient(): postgres.Sql {
  db();
  return client!;
}

/** A transaction handle, for functions that must run inside the caller's transaction. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
