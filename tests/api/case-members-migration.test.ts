import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import { afterAll, describe, expect, it } from 'vitest';
import { MIGRATIONS_FOLDER } from '../../api/src/db/client';

/** A copy of the migrations folder that stops before `tag`, as a database made before it saw them. */
function migrationsBefore(tag: string): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-migrations-'));
  fs.cpSync(MIGRATIONS_FOLDER, dir, { recursive: true });
  const journalFile = path.join(dir, 'meta', '_journal.json');
  const journal = JSON.parse(fs.readFileSync(journalFile, 'utf8')) as { entries: { tag: string }[] };
  const stop = journal.entries.findIndex((entry) => entry.tag === tag);
  if (stop < 0) throw new Error(`no migration ${tag}`);
  journal.entries = journal.entries.slice(0, stop);
  fs.writeFileSync(journalFile, JSON.stringify(journal));
  return dir;
}

const older = migrationsBefore('0007_case-members');
afterAll(() => fs.rmSync(older, { recursive: true, force: true }));

describe('case membership migration', () => {
  it('keeps the creator of every existing case as its member on upgrade', async () => {
    const client = new PGlite();
    try {
      const db = drizzle(client);
      await migrate(db, { migrationsFolder: older });
      await client.exec(`
        insert into users (id, email, name, role, password_hash)
          values ('00000000-0000-4000-8000-000000000001', 'early@driftcase.example', 'Early Bird', 'investigator', 'x');
        insert into cases (id, reference, title, site, robot_id, incident_time, severity, created_by)
          values ('00000000-0000-4000-8000-0000000000c1', 'DC-0001', 'Made before membership', 'Yard', 'R-1',
                  '2026-10-01T08:00:00Z', 'low', '00000000-0000-4000-8000-000000000001');`);
      await migrate(db, { migrationsFolder: MIGRATIONS_FOLDER });
      const members = await client.query<{ case_id: string; user_id: string }>(
        'select case_id, user_id from case_members',
      );
      expect(members.rows).toEqual([
        { case_id: '00000000-0000-4000-8000-0000000000c1', user_id: '00000000-0000-4000-8000-000000000001' },
      ]);
    } finally {
      await client.close();
    }
  });
});
