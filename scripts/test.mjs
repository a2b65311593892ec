#!/usr/bin/env node
// `npm test`: a throwaway PostgreSQL cluster, the fakes and the built app on free ports, then
// unit + integration tests (vitest) and the browser tests (vitest + playwright-core, serially).
// Extra arguments are passed to vitest as file filters: `npm test -- tests/unit/mpan`.
import { execFileSync, spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { ensureNodeModules, log, root } from './lib/stack.mjs';
import { startThrowawayStack } from './lib/throwaway-stack.mjs';

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

const filters = process.argv.slice(2);
let stack;
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, async () => {
    await stack?.stop();
    process.exit(130);
  });
}
let code = 1;
try {
  const chromium = ensureChromium();
  stack = await startThrowawayStack({ name: 'test' });
  const testEnv = { ...process.env, ...stack.env, CHROMIUM_PATH: chromium };
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
  await stack?.stop();
}
log(code === 0 ? 'All tests passed.' : 'Some tests failed.');
process.exit(code);
