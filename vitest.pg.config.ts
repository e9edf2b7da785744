import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

// The data layer against a real PostgreSQL server named by DATABASE_URL.
export default defineConfig({
  resolve: {
    alias: {
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  test: {
    include: ['tests/pg/**/*.test.ts'],
    // Starting a test app (PGlite + migrations) takes seconds on a quiet machine but can take a
    // minute or more on a shared CI runner; a hang still fails, just later.
    testTimeout: 120_000,
    hookTimeout: 240_000,
    fileParallelism: false,
    pool: 'forks',
  },
});
