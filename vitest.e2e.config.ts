import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Browser tests drive Debian's Chromium through playwright-core, one file at a time.
export default defineConfig({
  resolve: { alias: { '@': fileURLToPath(new URL('./src', import.meta.url)) } },
  test: {
    include: ['tests/e2e/**/*.test.ts'],
    testTimeout: 120_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    maxWorkers: 1,
    minWorkers: 1,
  },
});
