import { index, integer, jsonb, pgTable, real, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { bundles } from './bundles';
import { users } from './users';

/**
 * One re-run of the particle filter over a bundle. Results (series, keyframes, disagreement
 * counts) are files under `DATA_DIR/derived/replays/<id>/`; the row holds what lists and
 * findings cite: status, effective settings, digest, metrics and flags.
 */
export const replays = pgTable(
  'replays',
  {
    id: uuid('id').primaryKey(),
    bundleId: uuid('bundle_id')
      .notNull()
      .references(() => bundles.id),
    label: text('label').notNull().default(''),
    status: text('status', { enum: ['queued', 'running', 'done', 'failed', 'cancelled'] }).notNull(),
    /** What the requester asked to change from the manifest's filter block. */
    overrides: jsonb('overrides').notNull().default({}),
    /** The effective settings the engine ran with. */
    settings: jsonb('settings'),
    digest: text('digest'),
    /** Engine version, digest layout and runtime that produced the digest; null before engine 2.0.0. */
    engine: jsonb('engine'),
    steps: integer('steps'),
    elapsedMs: real('elapsed_ms'),
    metrics: jsonb('metrics'),
    flags: jsonb('flags'),
    error: text('error'),
    createdBy: uuid('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (table) => [index('replays_bundle_idx').on(table.bundleId)],
);

export type ReplayRow = typeof replays.$inferSelect;
