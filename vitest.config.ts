import { defineConfig } from 'vitest/config';
import { fileURLToPath } from 'node:url';

// Unit and integration tests. Integration tests read APP_URL, DATABASE_URL and
// MAIL_API_URL, which scripts/test.mjs sets after starting a throwaway stack.
export default defineConfig({
  resolve: { alias: { '~': fileURLToPath(new URL('./src', import.meta.url)), '@': fileURLToPath(new URL('./src', import.meta.url)) } },
  test: {
    include: ['tests/unit/**/*.test.ts', 'tests/integration/**/*.test.ts'],
    setupFiles: ['tests/setup/fail-on-console-error.ts'],
    testTimeout: 30_000,
    hookTimeout: 60_000,
    // Integration tests share one database and one server: keep files serial.
    fileParallelism: false,
  },
});
