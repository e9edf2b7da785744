import { defineConfig } from 'drizzle-kit';

export default defineConfig({
  dialect: 'postgresql',
  schema: './api/src/db/schema/index.ts',
  out: './api/src/db/migrations',
});
