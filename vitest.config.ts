import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// Unit, service and HTTP-boundary tests. Browser tests live in vitest.e2e.config.ts,
// real-PostgreSQL tests in vitest.pg.config.ts.
export default defineConfig({
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
      '@web': fileURLToPath(new URL('./web/src', import.meta.url)),
    },
  },
  test: {
    include: ['tests/**/*.test.ts', 'tests/**/*.test.tsx'],
    exclude: ['tests/e2e/**', 'tests/pg/**', 'node_modules/**'],
    // Starting a test app (PGlite + migrations) takes seconds on a quiet machine but can take a
    // minute or more on a shared CI runner; a hang still fails, just later.
    testTimeout: 120_000,
    hookTimeout: 240_000,
    pool: 'forks',
  },
});
