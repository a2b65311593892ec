// Server-only: one PostgreSQL pool for the process, shared by every query module, with the
// time limits that turn a stuck database or a coding mistake into a 503 instead of a frozen
// process (docs/decisions/010-timeouts-and-503.md).
import { AsyncLocalStorage } from 'node:async_hooks';
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import * as schema from '@/db/schema';
import { config } from './config.server';
import { HttpError, RETRY_AFTER_SECONDS } from './http';

export { isDatabaseUnavailable } from './db-errors.server';

type Db = ReturnType<typeof drizzle<typeof schema>>;
/** The transaction handed to a `transaction()` callback. */
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
/** Either the pool or a transaction: functions that may run inside one take this first. */
export type Conn = Db | Tx;

const seconds = (name: string, fallback: number) => {
  const n = Number(process.env[name]);
  return Number.isFinite(n) && n > 0 ? n : fallback;
};

/** The limits, in seconds; each can be set by an environment variable of the same meaning. */
export const dbLimits = {
  /** Connections in the pool (a count, not seconds). */
  poolSize: seconds('DATABASE_POOL_SIZE', 10),
  /** Opening a TCP connection to PostgreSQL. */
  connect: seconds('DB_CONNECT_TIMEOUT', 5),
  /** Waiting for a free pool connection before a transaction gives up with 503. */
  acquire: seconds('DB_ACQUIRE_TIMEOUT', 5),
  /** One statement (PostgreSQL `statement_timeout`). */
  statement: seconds('DB_STATEMENT_TIMEOUT', 15),
  /** A transaction left open with nothing running (PostgreSQL `idle_in_transaction_session_timeout`). */
  idleInTransaction: seconds('DB_IDLE_IN_TRANSACTION_TIMEOUT', 10),
};

let client: postgres.Sql | undefined;
let instance: Db | undefined;

// Set while a `transaction()` callback runs, so a pool query made inside one is caught at once.
const insideTransaction = new AsyncLocalStorage<true>();

/** The Drizzle database, connected on first use. Never call it inside a transaction: use its tx. */
export function db(): Db {
  if (insideTransaction.getStore()) {
    // Under load, a transaction waiting for a second pool connection starves the pool for good.
    const err = new Error('db() was called inside a transaction: pass the transaction (tx) to every function called inside it.');
    if (config.isTest) throw err;
    console.error(err);
  }
  if (!instance) {
    client = postgres(config.databaseUrl, {
      max: dbLimits.poolSize,
      connect_timeout: dbLimits.connect,
      // Idle connections are closed, and every connection is renewed now and then, so a
      // restarted PostgreSQL never leaves the pool holding dead sockets for long.
      idle_timeout: 60,
      max_lifetime: 30 * 60,
      // Behind a transaction-mode pooler (PgBouncer and the like) each transaction may land on a
      // different server connection, so named prepared statements must be off (docs/deploy.md).
      prepare: config.databasePrepare,
      onnotice: () => {},
      // Sent as startup parameters: they hold for every session of this pool, whatever the role.
      connection: {
        application_name: 'groundwork',
        statement_timeout: dbLimits.statement * 1000,
        idle_in_transaction_session_timeout: dbLimits.idleInTransaction * 1000,
      } as Record<string, unknown> as Partial<postgres.ConnectionParameters>,
    });
    instance = drizzle(preparing(client), { schema });
  }
  return instance;
}

/**
 * Drizzle sends a statement unnamed unless the query is given a name, so PostgreSQL would parse
 * and plan every query again on every call: for the office queue's search that planning cost more
 * than running it (`npm run bench`, README). postgres.js's own habit is to name each statement
 * and keep it on its connection, and this client asks for that on drizzle's behalf. The pool's
 * `prepare` setting still has the last word (DATABASE_PREPARE=false behind a transaction-mode
 * pooler sends none), and transactions and savepoints get the same client.
 */
function preparing(sql: postgres.Sql): postgres.Sql {
  return new Proxy(sql, {
    get(target, prop) {
      if (prop === 'unsafe') {
        return (query: string, params?: unknown[], options?: postgres.UnsafeQueryOptions) =>
          target.unsafe(query, params as postgres.ParameterOrJSON<never>[], { ...options, prepare: true });
      }
      if (prop === 'begin' || prop === 'savepoint') {
        return (...args: unknown[]) => {
          const work = args.pop() as (tx: postgres.Sql) => unknown;
          return (Reflect.get(target, prop) as (...a: unknown[]) => unknown)(...args, (tx: postgres.Sql) => work(preparing(tx)));
        };
      }
      return Reflect.get(target, prop, target);
    },
  });
}

/** The raw postgres.js client, for health checks and hand-written SQL. */
export function sqlClient(): postgres.Sql {
  db();
  return client!;
}

class AbandonedTransaction extends Error {}

/**
 * Runs `work` in a transaction, but waits at most `dbLimits.acquire` seconds for a connection:
 * postgres.js queues for a free one without any limit, so a full pool would otherwise freeze the
 * request. If the wait runs out the caller gets a 503, and should the connection still turn up
 * later the work is rolled back unrun. `work` must use only `tx`.
 *
 * @example const row = await transaction(async (tx) => (await tx.select().from(cases).where(eq(cases.id, id)).for('update'))[0]);
 */
export function transaction<T>(work: (tx: Tx) => Promise<T>): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    let started = false;
    let abandoned = false;
    const timer = setTimeout(() => {
      if (started) return;
      abandoned = true;
      reject(busy());
    }, dbLimits.acquire * 1000);
    db()
      .transaction(async (tx) => {
        started = true;
        clearTimeout(timer);
        if (abandoned) throw new AbandonedTransaction();
        return insideTransaction.run(true, () => work(tx));
      })
      .then(resolve, (err) => {
        clearTimeout(timer);
        if (!(err instanceof AbandonedTransaction)) reject(err);
      });
  });
}

const busy = () =>
  new HttpError(503, 'unavailable', 'We are very busy for a moment. Your answers are safe: please try again in a few seconds.', undefined, {
    retryAfter: RETRY_AFTER_SECONDS,
  });

