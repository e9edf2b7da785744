import { index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { bundles } from './bundles';
import { cases } from './cases';
import { users } from './users';

/**
 * A SQL query over a bundle's tables, saved with the SHA-256 of its canonical result so a
 * finding can cite it and anyone can re-run it and compare.
 */
export const savedQueries = pgTable(
  'saved_queries',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    bundleId: uuid('bundle_id')
      .notNull()
      .references(() => bundles.id),
    title: text('title').notNull(),
    sql: text('sql').notNull(),
    resultSha256: text('result_sha256').notNull(),
    rowCount: integer('row_count').notNull(),
    columns: jsonb('columns').notNull(),
    /** The first rows (at most 50) in canonical form; null when none was sent. */
    preview: jsonb('preview'),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index('saved_queries_case_idx').on(table.caseId)],
);

export type SavedQueryRow = typeof savedQueries.$inferSelect;
