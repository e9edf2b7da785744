import { doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { bundles } from './bundles';
import { cases } from './cases';
import { replays } from './replays';
import { users } from './users';

/**
 * A pinned moment of a replay. The replay's digest is copied in at pin time so a finding that
 * cites the bookmark can still be checked against the exact run it was taken from.
 */
export const bookmarks = pgTable(
  'bookmarks',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    bundleId: uuid('bundle_id')
      .notNull()
      .references(() => bundles.id),
    replayId: uuid('replay_id')
      .notNull()
      .references(() => replays.id),
    replayLabel: text('replay_label').notNull().default(''),
    replayDigest: text('replay_digest').notNull(),
    step: integer('step').notNull(),
    /** s since the bundle's start_time */
    t: doublePrecision('t').notNull(),
    /** Map view to restore: centre (map frame, m), zoom, follow mode, visible layers. */
    view: jsonb('view').notNull(),
    note: text('note').notNull(),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [index('bookmarks_case_idx').on(table.caseId)],
);

export type BookmarkRow = typeof bookmarks.$inferSelect;
