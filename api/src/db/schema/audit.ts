import { bigserial, index, integer, jsonb, pgTable, text, unique, uuid } from 'drizzle-orm/pg-core';

/**
 * Append-only, hash-chained log of every write and export. One chain per case (`case:<id>`)
 * and one `global` chain. A trigger refuses UPDATE, DELETE and TRUNCATE; the data layer has no
 * function that would issue them.
 */
export const auditEntries = pgTable(
  'audit_entries',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    chain: text('chain').notNull(),
    /** Position in the chain, from 1. */
    chainSeq: integer('chain_seq').notNull(),
    actorId: uuid('actor_id'),
    actorEmail: text('actor_email'),
    actorRole: text('actor_role'),
    action: text('action').notNull(),
    targetType: text('target_type').notNull(),
    targetId: text('target_id'),
    caseId: uuid('case_id'),
    /** RFC 3339 with milliseconds, stored as text so it is hashed exactly as written. */
    at: text('at').notNull(),
    payloadSha256: text('payload_sha256').notNull(),
    details: jsonb('details').notNull().default({}),
    prevHash: text('prev_hash').notNull(),
    entryHash: text('entry_hash').notNull(),
  },
  (table) => [
    unique('audit_entries_chain_seq_unique').on(table.chain, table.chainSeq),
    index('audit_entries_case_idx').on(table.caseId),
  ],
);

export type AuditEntryRow = typeof auditEntries.$inferSelect;
