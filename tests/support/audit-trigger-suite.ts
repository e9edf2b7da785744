import { sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { assertAuditTriggers, findUnprotectedAuditStatements } from '../../api/src/db/check-audit-triggers';
import type { DatabaseHandle } from '../../api/src/db/client';

/**
 * Start-up refuses a database whose audit trail lost its append-only triggers. Called from a
 * PGlite file and a PostgreSQL file; `fresh` opens a migrated database of its own.
 */
export function auditTriggerStartupSuite(fresh: () => Promise<DatabaseHandle>) {
  describe('start-up check of the append-only audit triggers', () => {
    it('passes on a migrated database', async () => {
      const handle = await fresh();
      try {
        expect(await findUnprotectedAuditStatements(handle.db)).toEqual([]);
        await expect(assertAuditTriggers(handle.db)).resolves.toBeUndefined();
      } finally {
        await handle.close();
      }
    });

    it.each([
      [
        'the UPDATE/DELETE trigger dropped',
        'drop trigger audit_entries_no_update_or_delete on audit_entries',
        /UPDATE, DELETE/,
      ],
      ['the TRUNCATE trigger dropped', 'drop trigger audit_entries_no_truncate on audit_entries', /TRUNCATE/],
      [
        'the UPDATE/DELETE trigger disabled',
        'alter table audit_entries disable trigger audit_entries_no_update_or_delete',
        /UPDATE, DELETE/,
      ],
      [
        'the refusing function replaced by one that allows changes',
        `create or replace function audit_entries_refuse_change() returns trigger language plpgsql as $$ begin return old; end; $$`,
        /UPDATE, DELETE, TRUNCATE/,
      ],
    ])('refuses to start with one clear line when %s', async (_name, statement, named) => {
      const handle = await fresh();
      try {
        await handle.db.execute(sql.raw(statement));
        const error = await assertAuditTriggers(handle.db).then(
          () => null,
          (e: Error) => e,
        );
        expect(error?.message).toMatch(named);
        expect(error?.message).toMatch(/^the audit trail is not append-only: .*refusing to start/);
        expect(error?.message).not.toContain('\n');
      } finally {
        await handle.close();
      }
    });
  });
}
