import { pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Secrets the server generates on first start (e.g. the session-token key). Kept in the database
 * so several API processes sharing one PostgreSQL server sign and check the same tokens.
 */
export const serverSecrets = pgTable('server_secrets', {
  name: text('name').primaryKey(),
  value: text('value').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});
