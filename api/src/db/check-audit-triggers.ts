import { sql } from 'drizzle-orm';
import type { Database } from './client';

// pg_trigger.tgtype bits (PostgreSQL src/include/catalog/pg_trigger.h).
const ROW = 1;
const BEFORE = 2;
const DELETE = 8;
const UPDATE = 16;
const TRUNCATE = 32;

/** What the append-only protection of audit_entries must refuse, as migration 0003 sets it up. */
const REQUIRED: { what: string; covers: (type: number) => boolean }[] = [
  { what: 'UPDATE', covers: (type) => (type & (BEFORE | ROW | UPDATE)) === (BEFORE | ROW | UPDATE) },
  { what: 'DELETE', covers: (type) => (type & (BEFORE | ROW | DELETE)) === (BEFORE | ROW | DELETE) },
  { what: 'TRUNCATE', covers: (type) => (type & (BEFORE | TRUNCATE)) === (BEFORE | TRUNCATE) },
];

/**
 * The statements on audit_entries that no enabled trigger refuses (empty when the append-only
 * protection is whole). Only triggers that run `audit_entries_refuse_change` count, so a
 * replaced function or a disabled trigger (`tgenabled = 'D'`) is reported too.
 */
export async function findUnprotectedAuditStatements(db: Database): Promise<string[]> {
  const result = await db.execute(sql`
    select t.tgtype as type
    from pg_trigger t
    join pg_class c on c.oid = t.tgrelid
    join pg_proc p on p.oid = t.tgfoid
    where c.relname = 'audit_entries' and not t.tgisinternal and t.tgenabled <> 'D'
      and p.proname = 'audit_entries_refuse_change'
      and position('RAISE EXCEPTION' in upper(p.prosrc)) > 0`);
  const rows = ((result as { rows?: unknown[] }).rows ?? (result as unknown as unknown[])) as {
    type: number;
  }[];
  const types = rows.map((row) => Number(row.type));
  return REQUIRED.filter((required) => !types.some(required.covers)).map((required) => required.what);
}

/** Throws one line for the start-up log when the audit trail's append-only triggers are not all in place. */
export async function assertAuditTriggers(db: Database): Promise<void> {
  const unprotected = await findUnprotectedAuditStatements(db);
  if (unprotected.length > 0) {
    throw new Error(
      `the audit trail is not append-only: no enabled trigger refuses ${unprotected.join(', ')} on audit_entries (migration 0003_audit-append-only.sql); refusing to start until it is restored, then check the chains with GET /api/audit/verify`,
    );
  }
}
