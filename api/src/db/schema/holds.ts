import { index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { cases } from './cases';
import { users } from './users';

/** Legal holds. A hold is active until `releasedAt` is set; released holds stay as history. */
export const caseHolds = pgTable(
  'case_holds',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    reason: text('reason').notNull(),
    placedBy: uuid('placed_by')
      .notNull()
      .references(() => users.id),
    placedAt: timestamp('placed_at', { withTimezone: true }).notNull().defaultNow(),
    releasedBy: uuid('released_by').references(() => users.id),
    releasedAt: timestamp('released_at', { withTimezone: true }),
    releaseReason: text('release_reason'),
  },
  (table) => [index('case_holds_case_idx').on(table.caseId)],
);

export type CaseHoldRow = typeof caseHolds.$inferSelect;
