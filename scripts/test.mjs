#!/usr/bin/env node
// `npm test`: a throwaway PostgreSQL cluster, the fakes and the built app on free ports, then
// unit + integration tests (vitest) and the browser tests (vitest + playwright-core, serially).
// Extra arguments are passed to vitest as file filters: `npm test -- tests/unit/mpan`.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  build, ensureNodeModules, freePort, log, migrate, root, runTsx, startChild, startDatabase, stopChildren, waitForHttp,
} from './lib/stack.mjs';

ensureNodeModules();

function ensureChromium() {
  const found = spawnSync('sh', ['-c', 'command -v chromium'], { encoding: 'utf8' });
  if (found.status === 0) return found.stdout.trim();
  log('Installing Chromium from Debian packages for the browser tests (one time)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'chromium', 'fonts-dejavu-core'], { stdio: 'inherit', env });
  return spawnSync('sh', ['-c', 'command -v chromium'], { encoding: 'utf8' }).stdout.trim();
}

const scratch = mkdtempSync(join(tmpdir(), 'groundwork-test-'));
const filters = process.argv.slice(2);
let db;
let outDir;
let code = 1;
try {
  const chromium = ensureChromium();
  const [pgPort, appPort, smtpPort, mailHttpPort] = [await freePort(), await freePort(), await freePort(), await freePort()];
  db = await startDatabase({
    dataDir: join(scratch, 'pg'),
    fallbackName: `groundwork-test-pg-${process.pid}`,
    port: pgPort,
    database: 'groundwork_test',
    password: 'groundwork-test',
    durable: false,
  });
  await migrate(db.url);
  const appUrl = `http://127.0.0.1:${appPort}`;
  const env = {
    DATABASE_URL: db.url,
    AUTH_SECRET: 'groundwork-test-secret-not-for-production',
    AUTH_TRUST_HOST: 'true',
    APP_URL: appUrl,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(smtpPort),
    UPLOAD_DIR: join(scratch, 'uploads'),
    DEMO_PASSWORD: 'groundwork-demo',
    HOST: '127.0.0.1',
    PORT: String(appPort),
    GROUNDWORK_TEST: '1',
    // Tests drive reminder sweeps themselves; the background schedule stays out of their way.
    REMINDER_SWEEP_CRON: '0 4 1 1 *',
  };
  runTsx('seeds/run.ts', env);
  startChild('fake mail', 'node', ['fake-services/mail-server.mjs'], {
    env: { FAKE_SMTP_PORT: String(smtpPort), FAKE_MAIL_HTTP_PORT: String(mailHttpPort) },
    quiet: true,
  });
  outDir = `.data/test-build-${process.pid}`;
  const entry = build(outDir, env);
  env.APP_ENTRY = entry;
  startChild('app', 'node', [entry], { env, quiet: true });
  startChild('worker', join(root, 'node_modules', '.bin', 'tsx'), ['scripts/worker.ts'], { env, quiet: true });
  await waitForHttp(`${appUrl}/api/health`);
  const testEnv = { ...process.env, ...env, MAIL_API_URL: `http://127.0.0.1:${mailHttpPort}`, CHROMIUM_PATH: chromium };
  const vitest = join(root, 'node_modules', '.bin', 'vitest');
  const unitFilters = filters.filter((f) => !f.includes('e2e'));
  const e2eFilters = filters.filter((f) => f.includes('e2e'));
  const runUnit = filters.length === 0 || unitFilters.length > 0;
  const runE2e = filters.length === 0 || e2eFilters.length > 0;
  code = 0;
  if (runUnit) {
    log('Unit and integration tests…');
    const r = spawnSync(vitest, ['run', ...unitFilters], { cwd: root, stdio: 'inherit', env: testEnv });
    code ||= r.status ?? 1;
  }
  if (runE2e) {
    log('Browser tests (Chromium, one at a time)…');
    const r = spawnSync(vitest, ['run', '--config', 'vitest.e2e.config.ts', ...e2eFilters], { cwd: root, stdio: 'inherit', env: testEnv });
    code ||= r.status ?? 1;
  }
} catch (err) {
  console.error(err instanceof Error ? err.stack : err);
  code = 1;
} finally {
  await stopChildren();
  db?.stop();
  rmSync(scratch, { recursive: true, force: true });
  if (outDir) rmSync(join(root, outDir), { recursive: true, force: true });
  if (db?.dataDir && !db.dataDir.startsWith(scratch)) rmSync(db.dataDir, { recursive: true, force: true });
}
log(code === 0 ? 'All tests passed.' : 'Some tests failed.');
process.exit(code);
