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
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
  },
});
