import { boolean, index, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { cases } from './cases';
import { users } from './users';

/** A fix linked to a case by an engineer, with the replay that checks it. */
export const caseFixes = pgTable(
  'case_fixes',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    url: text('url'),
    commitId: text('commit_id'),
    description: text('description').notNull(),
    /** Free text or JSON text, kept as typed so the archive shows exactly what was entered. */
    changedSettings: text('changed_settings'),
    softwareVersion: text('software_version'),
    verificationReplayId: uuid('verification_replay_id'),
    linkedBy: uuid('linked_by')
      .notNull()
      .references(() => users.id),
    linkedAt: timestamp('linked_at', { withTimezone: true }).notNull().defaultNow(),
    verifiedBy: uuid('verified_by').references(() => users.id),
    verifiedAt: timestamp('verified_at', { withTimezone: true }),
    verificationComment: text('verification_comment'),
    /** The verifier confirmed the fix although its verification replay showed no improvement. */
    isVerifiedWithoutImprovement: boolean('verified_without_improvement').notNull().default(false),
  },
  (table) => [index('case_fixes_case_idx').on(table.caseId)],
);

export type CaseFixRow = typeof caseFixes.$inferSelect;
