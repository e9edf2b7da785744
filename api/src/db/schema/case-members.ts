import { index, pgTable, primaryKey, timestamp, uuid } from 'drizzle-orm/pg-core';
import { cases } from './cases';
import { users } from './users';

/**
 * Who works on a case. A member's part on the case is their account role (investigator,
 * reviewer, engineer, legal); the creator is always a member.
 */
export const caseMembers = pgTable(
  'case_members',
  {
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id),
    addedBy: uuid('added_by').references(() => users.id),
    addedAt: timestamp('added_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    primaryKey({ columns: [table.caseId, table.userId] }),
    index('case_members_user_idx').on(table.userId),
  ],
);

export type CaseMemberRow = typeof caseMembers.$inferSelect;
