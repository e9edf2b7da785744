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
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
    pool: 'forks',
  },
});
