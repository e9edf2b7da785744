import { bigint, index, integer, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import { cases } from './cases';
import { replays } from './replays';
import { users } from './users';

/**
 * A picture saved to a case (the map or the timeline at a moment) for findings to cite. The
 * bytes live in the content-addressed evidence store under their SHA-256, like bundle originals.
 */
export const figures = pgTable(
  'figures',
  {
    id: uuid('id').primaryKey(),
    caseId: uuid('case_id')
      .notNull()
      .references(() => cases.id),
    sha256: text('sha256').notNull(),
    sizeBytes: bigint('size_bytes', { mode: 'number' }).notNull(),
    mediaType: text('media_type', { enum: ['image/png', 'image/svg+xml'] }).notNull(),
    fileName: text('file_name').notNull(),
    /** Which replay, digest and moment the picture shows, as printed on it. */
    caption: text('caption').notNull(),
    replayId: uuid('replay_id').references(() => replays.id),
    step: integer('step'),
    uploadedBy: uuid('uploaded_by')
      .notNull()
      .references(() => users.id),
    uploadedAt: timestamp('uploaded_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (table) => [
    unique('figures_case_sha_unique').on(table.caseId, table.sha256),
    index('figures_case_idx').on(table.caseId),
  ],
);

export type FigureRow = typeof figures.$inferSelect;
