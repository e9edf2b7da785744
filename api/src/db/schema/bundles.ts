import { bigint, index, jsonb, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { cases } from './cases';
import { users } from './users';

/**
 * An uploaded incident bundle. The original bytes live in the content-addressed evidence store
 * under their SHA-256; this row records who brought them, when, and what validation found.
 */
export const bundles = pgTable(
  'bundles',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    sha256: text('sha256').notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number' }).notNull(),
    originalName: text('original_name').notNull(),
    uploadedBy: uuid('uploaded_by')
      .notNull()
      .references(() => users.id),
    uploadedAt: timestamp('uploaded_at', { withTimezone: true }).notNull().defaultNow(),
    /** `validating` from the moment the original is stored until it has been read. */
    status: text('status', { enum: ['validating', 'valid', 'invalid'] }).notNull(),
    /** Validation problems (errors and warnings), as `BundleIssue[]`. */
    issues: jsonb('issues').notNull().default([]),
    /** Every file inside the bundle with its size and SHA-256. */
    files: jsonb('files').notNull().default([]),
    /** Row counts, time span, sensors present; null when the bundle could not be read. */
    summary: jsonb('summary'),
    /** The parsed manifest.json of a valid bundle (robot, sensors, filter settings); null when invalid. */
    manifest: jsonb('manifest'),
    /** Derived Arrow tables: `{ name, rows }[]`. */
    tables: jsonb('tables').notNull().default([]),
  },
  (table) => [
    unique('bundles_case_sha_unique').on(table.caseId, table.sha256),
    index('bundles_case_idx').on(table.caseId),
  ],
);

export type BundleRow = typeof bundles.$inferSelect;
