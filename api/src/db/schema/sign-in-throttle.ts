import { integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';

/**
 * Sign-in attempts counted per account (`account:<e-mail>`) and per client address
 * (`address:<ip>`). Kept in the database, not in one process's memory, so several API processes
 * on one database share the count.
 */
export const signInThrottle = pgTable('sign_in_throttle', {
  key: text('key').primaryKey(),
  /** Attempts not (yet) proven successful since `windowStartedAt`. */
  failures: integer('failures').notNull().default(0),
  windowStartedAt: timestamp('window_started_at', { withTimezone: true }).notNull().defaultNow(),
  /** How many times this key has been locked; each lock lasts twice as long as the one before. */
  lockouts: integer('lockouts').notNull().default(0),
  lockedUntil: timestamp('locked_until', { withTimezone: true }),
});
