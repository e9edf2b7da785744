import { index, integer, jsonb, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { cases } from './cases';
import { users } from './users';

/** The one editable findings draft of a case; submitting freezes it into `finding_versions`. */
export const findingDrafts = pgTable('finding_drafts', {
  caseId: uuid('case_id')
    .primaryKey()
    .references(() => cases.id),
  content: jsonb('content').notNull(),
  updatedBy: uuid('updated_by')
    .notNull()
    .references(() => users.id),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * A frozen findings version. `canonical` is the exact RFC 8785 text that was hashed and signed,
 * kept verbatim because jsonb may reorder keys and reformat numbers.
 */
export const findingVersions = pgTable(
  'finding_versions',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    version: integer('version').notNull(),
    canonical: text('canonical').notNull(),
    sha256: text('sha256').notNull(),
    authorId: uuid('author_id')
      .notNull()
      .references(() => users.id),
    submittedAt: text('submitted_at').notNull(),
  },
  (table) => [unique('finding_versions_case_version_unique').on(table.caseId, table.version)],
);

/** A reviewer's decision on a version: a detached JWS sign-off or a return with a comment. */
export const findingReviews = pgTable(
  'finding_reviews',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    version: integer('version').notNull(),
    kind: text('kind', { enum: ['signoff', 'return'] }).notNull(),
    reviewerId: uuid('reviewer_id')
      .notNull()
      .references(() => users.id),
    at: text('at').notNull(),
    comment: text('comment'),
    jws: text('jws'),
    kid: text('kid'),
    /** Extra review data kept for the archive (e.g. the acknowledged caution text). */
    meta: jsonb('meta').notNull().default({}),
  },
  (table) => [index('finding_reviews_case_idx').on(table.caseId, table.version)],
);

export type FindingVersionRow = typeof findingVersions.$inferSelect;
export type FindingReviewRow = typeof findingReviews.$inferSelect;
