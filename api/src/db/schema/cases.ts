import { index, pgSequence, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { users } from './users';

/** Numbers the human-readable case references (DC-0001, DC-0002, ...). */
export const caseReferenceSeq = pgSequence('case_reference_seq', { startWith: 1 });

export const cases = pgTable(
  'cases',
  {
    id: uuid('id').primaryKey(),
    reference: text('reference').notNull().unique(),
    title: text('title').notNull(),
    site: text('site').notNull(),
    robotId: text('robot_id').notNull(),
    incidentTime: timestamp('incident_time', { withTimezone: true }).notNull(),
    severity: text('severity', { enum: ['low', 'medium', 'high', 'critical'] }).notNull(),
    status: text('status', {
      enum: ['open', 'analysing', 'in_review', 'changes_requested', 'signed_off', 'closed'],
    })
      .notNull()
      .default('open'),
    summary: text('summary').notNull().default(''),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    index('cases_incident_time_idx').on(table.incidentTime),
    index('cases_status_idx').on(table.status),
  ],
);

export type CaseRow = typeof cases.$inferSelect;
