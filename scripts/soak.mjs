#!/usr/bin/env node
// `npm run soak`: many customers filling in their checklists at once, against a throwaway stack.
// The demo admin invites N customers (default 50); each signs in through the link in the
// invitation e-mail (read from the fake mail service's JSON API) and autosaves realistic edits
// with If-Match for a fixed time (default 60 s), like the checklist's autosave queue: on a 409 it
// takes the version the conflict hands back and sends again. Every tenth customer has a second
// tab open, editing other answers at the same time, so conflicts really happen. At the end every
// case is read back and compared with the last save the server acknowledged for each answer.
//
//   npm run soak                         # 50 customers, 60 s
//   npm run soak -- --customers 20 --seconds 30
//   SOAK_THINK_MS=800 npm run soak       # pause between one customer's saves (random 0.5–1.5×)
import { ensureNodeModules, log } from './lib/stack.mjs';
import { startThrowawayStack } from './lib/throwaway-stack.mjs';

ensureNodeModules();
const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`);
  return Number(i > 0 ? process.argv[i + 1] : (process.env[`SOAK_${name.toUpperCase()}`] ?? fallback));
};
const CUSTOMERS = arg('customers', 50);
const SECONDS = arg('seconds', 60);
const THINK_MS = Number(process.env.SOAK_THINK_MS ?? 1000);
const SECOND_TAB_EVERY = 10;

/** A cookie jar and fetch, as a browser would keep them. */
class Browser {
  constructor(base) {
    this.base = base;
    this.cookies = new Map();
  }
  async fetch(path, init = {}) {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '));
    if (init.method && init.method !== 'GET') headers.set('origin', this.base);
    const res = await fetch(new URL(path, this.base), { ...init, headers, redirect: 'manual' });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      if (/max-age=0/i.test(c) || pair.slice(i + 1) === '') this.cookies.delete(pair.slice(0, i));
      else this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
    return res;
  }
  async json(method, path, body, headers = {}) {
    const res = await this.fetch(path, { method, headers: { 'content-type': 'application/json', ...headers }, body: body === undefined ? undefined : JSON.stringify(body) });
    const text = await res.text();
    let data = text;
    try {
      data = JSON.parse(text);
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: data };
  }
}

// Realistic edits: the answers a customer types or picks, each stored exactly as sent.
const towns = ['Quillbury', 'Oldbridge', 'Fernmoor', 'Ashcombe', 'Larkfield'];
const edits = {
  first: [
    () => ['about', 'addressLine2', `Flat ${1 + Math.floor(Math.random() * 40)}`],
    () => ['about', 'town', towns[Math.floor(Math.random() * towns.length)]],
    () => ['vehicle', 'make', ['Example Motors', 'Sample Cars', 'Demo Autos'][Math.floor(Math.random() * 3)]],
    () => ['vehicle', 'model', `Model ${String.fromCharCode(65 + Math.floor(Math.random() * 26))}${Math.floor(Math.random() * 9)}`],
    () => ['supply', 'mainFuseAmps', [60, 80, 100][Math.floor(Math.random() * 3)]],
    () => ['supply', 'consumerUnitLocation', ['Under the stairs', 'In the garage', 'Hall cupboard'][Math.floor(Math.random() * 3)]],
  ],
  second: [
    () => ['parking', 'kind', ['attached-drive', 'garage', 'detached-bay'][Math.floor(Math.random() * 3)]],
    () => ['parking', 'cars', Math.floor(Math.random() * 4)],
    () => ['charger', 'location', `On the wall ${1 + Math.floor(Math.random() * 9)} m from the door`],
    () => ['charger', 'cableRunMetres', Math.round(Math.random() * 300) / 10],
  ],
};

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));
const percentile = (sorted, p) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN);

async function signInAdmin(base, password) {
  const admin = new Browser(base);
  const csrf = await (await admin.fetch('/api/auth/csrf')).json();
  const res = await admin.fetch('/api/auth/callback/credentials', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-auth-return-redirect': '1' },
    body: new URLSearchParams({ csrfToken: csrf.csrfToken, email: 'admin@example.com', password, callbackUrl: '/home' }),
  });
  const body = await res.json();
  if (res.status !== 200 || String(body.url).includes('error=')) throw new Error(`admin sign-in failed: ${res.status}`);
  return admin;
}

async function invitationLink(mailApi, email, base) {
  for (let i = 0; i < 200; i++) {
    const list = await (await fetch(`${mailApi}/api/messages?to=${encodeURIComponent(email)}`)).json();
    const link = list[0]?.text.match(/https?:\/\/\S+/g)?.find((u) => u.startsWith(`${base}/api/auth/callback/`));
    if (link) return link;
    await sleep(100);
  }
  throw new Error(`no invitation e-mail for ${email}`);
}

const stack = await startThrowawayStack({ name: 'soak', worker: true });
let failed = false;
try {
  const base = stack.env.APP_URL;
  const admin = await signInAdmin(base, stack.env.DEMO_PASSWORD);
  log(`Inviting ${CUSTOMERS} customers and signing each in through the e-mailed link…`);
  const customers = [];
  for (let i = 0; i < CUSTOMERS; i++) {
    const email = `soak-${i + 1}-${process.pid}@example.com`;
    const invited = await admin.json('POST', '/api/cases', { customer: { name: `Soak Customer ${i + 1}`, email } });
    if (invited.status !== 201) throw new Error(`invite ${email}: ${invited.status} ${JSON.stringify(invited.body)}`);
    const browser = new Browser(base);
    const signedIn = await browser.fetch(await invitationLink(stack.env.MAIL_API_URL, email, base));
    if (signedIn.status !== 302 || (signedIn.headers.get('location') ?? '').includes('error=')) throw new Error(`sign-in for ${email}: ${signedIn.status}`);
    customers.push({ email, caseId: invited.body.id, browser, acked: new Map() });
  }

  const stats = { saves: 0, conflicts: 0, errors: 0, latencies: [], errorSamples: [] };
  const until = Date.now() + SECONDS * 1000;

  /** One tab: edit, save with If-Match, on 409 take the current version and send again. */
  async function tab(customer, pool) {
    let version = (await customer.browser.json('GET', `/api/cases/${customer.caseId}`)).body.version;
    await sleep(Math.random() * THINK_MS);
    while (Date.now() < until) {
      const [section, field, value] = pool[Math.floor(Math.random() * pool.length)]();
      for (let attempt = 0; attempt < 5; attempt++) {
        const t = performance.now();
        let r;
        try {
          r = await customer.browser.json('PATCH', `/api/cases/${customer.caseId}/checklist`, { [section]: { [field]: value } }, { 'if-match': String(version) });
        } catch (err) {
          r = { status: 0, body: String(err) };
        }
        stats.latencies.push(performance.now() - t);
        if (r.status === 200) {
          stats.saves++;
          version = r.body.version;
          const key = `${section}.${field}`;
          const before = customer.acked.get(key);
          if (!before || before.version <= r.body.version) customer.acked.set(key, { version: r.body.version, value });
          break;
        }
        if (r.status === 409 && r.body?.error?.current) {
          stats.conflicts++;
          version = r.body.error.current.version;
          continue;
        }
        stats.errors++;
        if (stats.errorSamples.length < 5) stats.errorSamples.push(`${r.status} ${JSON.stringify(r.body).slice(0, 200)}`);
        await sleep(1000);
        break;
      }
      await sleep(THINK_MS * (0.5 + Math.random()));
    }
  }

  log(`${CUSTOMERS} customers autosaving for ${SECONDS}s (every ${SECOND_TAB_EVERY}th with a second tab)…`);
  const started = performance.now();
  // A customer with two tabs edits some answers in each; the others edit everything in one.
  await Promise.all(
    customers.flatMap((c, i) => (i % SECOND_TAB_EVERY === 0 ? [tab(c, edits.first), tab(c, edits.second)] : [tab(c, [...edits.first, ...edits.second])])),
  );
  const elapsed = (performance.now() - started) / 1000;

  log('Reading every case back…');
  let lost = 0;
  const lostSamples = [];
  for (const c of customers) {
    const { status, body } = await c.browser.json('GET', `/api/cases/${c.caseId}`);
    if (status !== 200) {
      stats.errors++;
      continue;
    }
    for (const [key, { value }] of c.acked) {
      const [section, field] = key.split('.');
      const stored = body.checklist?.[section]?.[field];
      if (stored !== value) {
        lost++;
        if (lostSamples.length < 5) lostSamples.push(`${c.email} ${key}: acknowledged ${JSON.stringify(value)}, stored ${JSON.stringify(stored)}`);
      }
    }
  }

  const sorted = stats.latencies.sort((a, b) => a - b);
  const ms = (p) => percentile(sorted, p).toFixed(0);
  const tabs = customers.length + customers.filter((_, i) => i % SECOND_TAB_EVERY === 0).length;
  console.log(`
  Groundwork soak — ${new Date().toISOString()}
  customers            ${customers.length} (${tabs} tabs)
  duration             ${elapsed.toFixed(1)} s
  saves acknowledged   ${stats.saves}
  conflicts (409)      ${stats.conflicts}
  errors               ${stats.errors}
  lost saves           ${lost}
  save latency p50     ${ms(50)} ms
  save latency p95     ${ms(95)} ms
  save latency p99     ${ms(99)} ms
  saves per second     ${(stats.saves / elapsed).toFixed(1)}
`);
  for (const s of [...stats.errorSamples, ...lostSamples]) console.log(`  ! ${s}`);
  failed = stats.errors > 0 || lost > 0;
} catch (err) {
  console.error(err instanceof Error ? err.stack : err);
  failed = true;
} finally {
  await stack.stop();
}
process.exit(failed ? 1 : 0);
