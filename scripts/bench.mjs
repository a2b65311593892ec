#!/usr/bin/env node
// `npm run bench`: seeds 10,000 cases into a throwaway stack, then measures GET /api/cases with a
// filter, a search and a sort under 10 concurrent connections (autocannon), beside the same
// query run straight through the database driver, and checklist saves spread over 1,000 cases.
// Prints p50/p95 in milliseconds.
import { ensureNodeModules, log } from './lib/stack.mjs';
import { startThrowawayStack } from './lib/throwaway-stack.mjs';

ensureNodeModules();
const CASES = Number(process.env.BENCH_CASES ?? 10_000);
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const { default: postgres } = await import('postgres');
const { default: autocannon } = await import('autocannon');

const stack = await startThrowawayStack({ name: 'bench', worker: false });
try {
  const sql = postgres(stack.env.DATABASE_URL, { max: 10, onnotice: () => {} });
  log(`Seeding ${CASES} cases…`);
  // Invented people and homes, made in SQL so 10,000 rows take seconds. Every third has no
  // parking (red), the rest are amber or green; postcodes and MPAN-shaped numbers vary.
  await sql`
    insert into users (id, name, email, role)
    select 'bench-' || g, 'Bench Customer ' || g, 'bench' || g || '@example.org', 'customer'
    from generate_series(1, ${CASES}) g`;
  await sql`
    insert into cases (reference, customer_id, address_line1, town, postcode, stage, checklist, invited_at,
                       readiness_light, readiness_rank, readiness_gaps, readiness_checks)
    select 'GWB' || lpad(g::text, 6, '0'), 'bench-' || g, g || ' Bench Street', 'Quillbury',
           'AB' || (g % 9 + 1) || ' ' || (g % 10) || 'XY',
           (array['invited','filling_in','sent_for_review','in_review','ready_for_survey'])[g % 5 + 1]::case_stage,
           jsonb_build_object('supply', jsonb_build_object('mpanCore', (1000000000000 + g)::text),
                              'vehicle', jsonb_build_object('deliveryDate', to_char(now()::date + (g % 90), 'YYYY-MM-DD'))),
           now() - (g % 60) * interval '1 day',
           (array['red','amber','green'])[g % 3 + 1]::readiness_light, g % 3, g % 9,
           jsonb_build_array(jsonb_build_object('id', 'parking', 'light', (array['red','amber','green'])[g % 3 + 1], 'title', 'Parking'))
    from generate_series(1, ${CASES}) g`;
  await sql`update cases c set search_text = lower(concat_ws(' ', u.name, u.email, replace(coalesce(c.postcode, ''), ' ', ''), c.reference, c.checklist -> 'supply' ->> 'mpanCore')) from users u where u.id = c.customer_id`;
  await sql`analyze`;
  if (process.env.BENCH_EXPLAIN) {
    await sql`alter system set log_min_duration_statement = 100`;
    await sql`select pg_reload_conf()`;
  }

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

  const path = '/api/cases?light=red,amber&q=customer%204242&sort=invited&dir=desc&pageSize=50';
  const check = await fetch(base + path, { headers: { cookie } });
  const sample = await check.json();
  if (check.status !== 200) throw new Error(`GET ${path} answered ${check.status}: ${JSON.stringify(sample)}`);
  log(`Query matches ${sample.total} cases; measuring for ${SECONDS}s with 10 connections…`);

  const http = await autocannon({ url: base + path, connections: 10, duration: SECONDS, headers: { cookie } });

  // Checklist saves as the office makes them (PATCH, zod, a transaction that rewrites the answers,
  // recomputes readiness and writes the audit entry), spread over 1,000 cases so rows do not queue on one lock.
  const saveIds = (await sql`select id from cases order by random() limit 1000`).map((r) => r.id);
  // Ten fetch loops rather than autocannon, whose per-request bodies did not arrive with PATCH here.
  let nth = 0;
  const saveTimes = [];
  let saveFailures = 0;
  const saveUntil = Date.now() + SECONDS * 1000;
  const saver = async () => {
    while (Date.now() < saveUntil) {
      const n = nth++;
      const t = performance.now();
      const res = await fetch(`${base}/api/cases/${saveIds[n % saveIds.length]}/checklist`, {
        method: 'PATCH',
        headers: { cookie, origin: base, 'content-type': 'application/json' },
        body: JSON.stringify({ vehicle: { model: `Bench ${n}` } }),
      });
      await res.arrayBuffer();
      if (res.status === 200) saveTimes.push(performance.now() - t);
      else saveFailures++;
    }
  };
  await Promise.all(Array.from({ length: 10 }, saver));
  saveTimes.sort((a, b) => a - b);
  const savePct = (p) => saveTimes[Math.min(saveTimes.length - 1, Math.floor((p / 100) * saveTimes.length))] ?? 0;

  // The same filter, search, sort and page straight through postgres.js.
  const direct = [];
  const until = Date.now() + SECONDS * 1000;
  const worker = async () => {
    while (Date.now() < until) {
      const t = performance.now();
      await sql`
        select c.id, c.reference, u.name, u.email, c.address_line1, c.postcode, c.readiness_light, c.readiness_gaps, c.stage, c.invited_at,
               (c.checklist -> 'vehicle' ->> 'deliveryDate') as delivery, count(*) over () as total
        from cases c join users u on u.id = c.customer_id left join users s on s.id = c.surveyor_id
        where c.readiness_light in ('red', 'amber')
          and (c.search_text like '%customer 4242%' or c.search_text like '%customer4242%')
        order by c.invited_at desc nulls last, c.id limit 50`;
      direct.push(performance.now() - t);
    }
  };
  if (process.env.BENCH_EXPLAIN) {
    const plan = await sql.unsafe(`explain analyze select "cases"."id", "users"."name", count(*) over () from "cases" inner join "users" on "users"."id" = "cases"."customer_id" left join "users" "surveyor" on "surveyor"."id" = "cases"."surveyor_id" where ("cases"."readiness_light" in ('red', 'amber') and ("cases"."search_text" like '%customer 4242%' or "cases"."search_text" like '%customer4242%')) order by "cases"."invited_at" desc nulls last, "cases"."invited_at" desc, "cases"."id" asc limit 50`);
    console.log(plan.map((r) => r['QUERY PLAN']).join('\n'));
  }
  await Promise.all(Array.from({ length: 10 }, worker));
  direct.sort((a, b) => a - b);
  const pct = (p) => direct[Math.min(direct.length - 1, Math.floor((p / 100) * direct.length))];
  await sql.end();
  if (process.env.BENCH_EXPLAIN) {
    const { readFileSync, readdirSync } = await import('node:fs');
    const dir = readdirSync('/tmp').find((d) => d.startsWith(`groundwork-bench-pg-${process.pid}`));
    if (dir) console.log(readFileSync(`/tmp/${dir}/server.log`, 'utf8').split('\n').filter((l) => l.includes('duration')).slice(0, 3).join('\n'));
  }

  const rows = [
    ['GET /api/cases (HTTP, autocannon)', http.latency.p50, http.latency.p97_5 ?? http.latency.p99, http.requests.average, http.non2xx],
    ['same query via postgres.js', pct(50), pct(95), direct.length / SECONDS, 0],
  ];
  console.log(`\n${CASES} cases, 10 concurrent connections, ${SECONDS}s each`);
  console.log('| measured | p50 ms | p95 ms | requests/s | non-2xx |');
  console.log('| --- | --- | --- | --- | --- |');
  // autocannon reports p50, p90, p97.5 and p99 but not p95; its p97.5 is shown as the upper bound.
  const p95http = http.latency.p90 !== undefined ? `${http.latency.p90}–${http.latency.p97_5}` : String(rows[0][2]);
  console.log(`| ${rows[0][0]} | ${rows[0][1]} | ${p95http} (p90–p97.5) | ${Math.round(rows[0][3])} | ${rows[0][4]} |`);
  console.log(`| ${rows[1][0]} | ${rows[1][1].toFixed(1)} | ${rows[1][2].toFixed(1)} | ${Math.round(rows[1][3])} | 0 |`);
  console.log(`| PATCH /api/cases/:id/checklist (HTTP, 10 fetch loops) | ${savePct(50).toFixed(1)} | ${savePct(95).toFixed(1)} | ${Math.round(saveTimes.length / SECONDS)} | ${saveFailures} |`);
} finally {
  await stack.stop();
}
