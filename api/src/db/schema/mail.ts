import { bigserial, index, integer, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';

/** Mail waiting to be sent, with its retry state. A background loop drains it. */
export const mailQueue = pgTable(
  'mail_queue',
  {
    id: uuid('id').primaryKey(),
    to: jsonb('to').$type<string[]>().notNull(),
    subject: text('subject').notNull(),
    text: text('text').notNull(),
    html: text('html').notNull(),
    status: text('status', { enum: ['pending', 'sent', 'failed'] })
      .notNull()
      .default('pending'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: timestamp('next_attempt_at', { withTimezone: true }).notNull().defaultNow(),
    /** One `{ at, ok, error? }` per attempt. */
    attemptLog: jsonb('attempt_log')
      .$type<{ at: string; ok: boolean; error?: string }[]>()
      .notNull()
      .default([]),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp('sent_at', { withTimezone: true }),
  },
  (table) => [index('mail_queue_due_idx').on(table.status, table.nextAttemptAt)],
);

/** Every message the local fake SMTP server received, for the admin Outbox page. */
export const outboxMessages = pgTable('outbox_messages', {
  id: bigserial('id', { mode: 'number' }).primaryKey(),
  from: text('from').notNull(),
  to: jsonb('to').$type<string[]>().notNull(),
  subject: text('subject').notNull(),
  text: text('text').notNull(),
  html: text('html').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});
