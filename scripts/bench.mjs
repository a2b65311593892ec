#!/usr/bin/env node
// `npm run bench`: the office queue API against its own SQL. Seeds a throwaway stack with
// invented cases, then for each size in BENCH_CASES (default 10,000 and 100,000, one run) measures
// GET /api/cases with a light filter, a name search and a sort under 10 concurrent connections
// (autocannon), beside the very SQL that request runs (queuePageQuery(...).toSQL()) sent straight
// through postgres.js by 10 concurrent callers. Prints p50/p95 in milliseconds and the ratio;
// the target is HTTP ≤ 1.5 × SQL at both percentiles. Runs under tsx to reuse the app's query.
import { ensureNodeModules, log } from './lib/stack.mjs';
import { startThrowawayStack } from './lib/throwaway-stack.mjs';
import { seedBenchCases } from './lib/bench-seed.mjs';

ensureNodeModules();
const SIZES = String(process.env.BENCH_CASES ?? '10000,100000').split(',').map(Number).filter((n) => n > 0).sort((a, b) => a - b);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 10;
const TARGET = 1.5;
const { default: postgres } = await import('postgres');
const { default: autocannon } = await import('autocannon');

const stack = await startThrowawayStack({ name: 'bench', worker: false });
Object.assign(process.env, stack.env);
const { queuePageQuery } = await import('../src/lib/server/queue.server.ts');
const { queueQueryFromParams } = await import('../src/lib/schemas/queue.ts');

const pct = (sorted, p) => sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
const results = [];
try {
  const sql = postgres(stack.env.DATABASE_URL, { max: CONNECTIONS, onnotice: () => {} });

  // Sign in as the demo admin, as a browser would.
  const base = stack.env.APP_URL;
  const csrfRes = await fetch(`${base}/api/auth/csrf`);
  const jar = csrfRes.headers.getSetCookie().map((c) => c.split(';')[0]);
  const { csrfToken } = await csrfRes.json();
  const signIn = await fetch(`${base}/api/auth/callback/credentials`, {
    method: 'POST',
    redirect: 'manual',
    headers: { 'content-type': 'application/x-www-form-urlencoded', cookie: jar.join('; '), origin: base, 'x-auth-return-redirect': '1' },
    body: new URLSearchParams({ csrfToken, email: 'admin@example.com', password: stack.env.DEMO_PASSWORD, callbackUrl: '/home' }),
  });
  const cookie = [...jar, ...signIn.headers.getSetCookie().map((c) => c.split(';')[0])].join('; ');
  const [admin] = await sql`select id, email, name, role from users where email = 'admin@example.com'`;

  const path = '/api/cases?light=red,amber&q=customer%204242&sort=invited&dir=desc&pageSize=50';
  const parsed = queueQueryFromParams(new URL(path, base).searchParams);
  if (!parsed.success) throw new Error('the benchmark query does not parse');
  const own = queuePageQuery(admin, parsed.data).toSQL();

  let seeded = 0;
  for (const size of SIZES) {
    await seedBenchCases(sql, seeded + 1, size);
    seeded = size;
    const check = await fetch(base + path, { headers: { cookie } });
    const sample = await check.json();
    if (check.status !== 200) throw new Error(`GET ${path} answered ${check.status}: ${JSON.stringify(sample)}`);
    log(`${size} cases: the query matches ${sample.total}; ${SECONDS}s over HTTP, then ${SECONDS}s of its SQL, ${CONNECTIONS} at a time…`);

    // Warm up both sides first (the app compiles its routes on first use; PostgreSQL fills its cache).
    await autocannon({ url: base + path, connections: CONNECTIONS, duration: 2, headers: { cookie } });
    for (let i = 0; i < 50; i++) await sql.unsafe(own.sql, own.params, { prepare: true });

    const httpTimes = [];
    const run = autocannon({ url: base + path, connections: CONNECTIONS, duration: SECONDS, headers: { cookie } });
    run.on('response', (_client, _status, _bytes, ms) => httpTimes.push(ms));
    const http = await run;

    const direct = [];
    const until = Date.now() + SECONDS * 1000;
    const caller = async () => {
      while (Date.now() < until) {
        const t = performance.now();
        await sql.unsafe(own.sql, own.params, { prepare: true });
        direct.push(performance.now() - t);
      }
    };
    await Promise.all(Array.from({ length: CONNECTIONS }, caller));
    httpTimes.sort((a, b) => a - b);
    direct.sort((a, b) => a - b);
    results.push({
      size,
      matches: sample.total,
      http: { p50: pct(httpTimes, 50), p95: pct(httpTimes, 95), rps: http.requests.average, non2xx: http.non2xx },
      sql: { p50: pct(direct, 50), p95: pct(direct, 95), rps: direct.length / SECONDS },
    });
  }
  await sql.end();
} finally {
  await stack.stop();
}

console.log(`\nGET ${'/api/cases?light=red,amber&q=customer 4242&sort=invited&dir=desc&pageSize=50'}, ${CONNECTIONS} concurrent connections, ${SECONDS}s each`);
console.log('| cases | measured | p50 ms | p95 ms | requests/s | non-2xx |');
console.log('| --- | --- | --- | --- | --- | --- |');
for (const r of results) {
  console.log(`| ${r.size} | GET /api/cases (HTTP, autocannon) | ${r.http.p50.toFixed(1)} | ${r.http.p95.toFixed(1)} | ${Math.round(r.http.rps)} | ${r.http.non2xx} |`);
  console.log(`| ${r.size} | its SQL via postgres.js | ${r.sql.p50.toFixed(1)} | ${r.sql.p95.toFixed(1)} | ${Math.round(r.sql.rps)} | 0 |`);
}
console.log('');
let met = true;
for (const r of results) {
  const a = r.http.p50 / r.sql.p50;
  const b = r.http.p95 / r.sql.p95;
  met &&= a <= TARGET && b <= TARGET && r.http.non2xx === 0;
  console.log(`${r.size} cases: HTTP / SQL = ${a.toFixed(2)} at p50, ${b.toFixed(2)} at p95 (target ≤ ${TARGET})`);
}
console.log(met ? 'Target met at every size.' : 'Target NOT met at every size.');
