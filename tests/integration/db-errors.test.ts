// Which driver errors mean "the database is unavailable" (answer 503) and which are bugs (500).
// The errors are real ones, raised by postgres.js against the test cluster and a closed port;
// the SQLSTATE codes are those of the PostgreSQL manual, Appendix A.
import net from 'node:net';
import postgres from 'postgres';
import { drizzle } from 'drizzle-orm/postgres-js';
import { sql as raw } from 'drizzle-orm';
import { afterAll, describe, expect, it } from 'vitest';
import { isDatabaseUnavailable } from '@/lib/server/db-errors.server';

const url = process.env.DATABASE_URL!;
const client = postgres(url, { max: 1, onnotice: () => {}, connection: { statement_timeout: 100 } as any });
afterAll(() => client.end());

const caught = async (run: () => Promise<unknown>) => {
  try {
    await run();
  } catch (err) {
    return err;
  }
  throw new Error('expected an error');
};

describe('isDatabaseUnavailable', () => {
  it('is true for a refused connection (nothing listens on the port)', async () => {
    const port = await new Promise<number>((r) => {
      const s = net.createServer().listen(0, '127.0.0.1', () => {
        const { port } = s.address() as net.AddressInfo;
        s.close(() => r(port));
      });
    });
    const dead = postgres(`postgres://x:y@127.0.0.1:${port}/none`, { max: 1, connect_timeout: 2 });
    const err = await caught(() => dead`select 1`);
    expect((err as { code?: string }).code).toBe('ECONNREFUSED');
    expect(isDatabaseUnavailable(err)).toBe(true);
    await dead.end();
  });

  it('is true for a statement cut off by statement_timeout (57014), also when Drizzle wraps it', async () => {
    const err = await caught(() => drizzle(client).execute(raw`select pg_sleep(1)`));
    expect((err as { cause?: { code?: string } }).cause?.code).toBe('57014');
    expect(isDatabaseUnavailable(err)).toBe(true);
  });

  it('is false for a bug: an unknown table (42P01) or a broken query (42601)', async () => {
    expect(isDatabaseUnavailable(await caught(() => client`select * from no_such_table`))).toBe(false);
    expect(isDatabaseUnavailable(await caught(() => client.unsafe('select from where')))).toBe(false);
    expect(isDatabaseUnavailable(new Error('plain'))).toBe(false);
  });
});
