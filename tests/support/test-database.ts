import { PGlite } from '@electric-sql/pglite';
import { drizzle } from 'drizzle-orm/pglite';
import { migrate } from 'drizzle-orm/pglite/migrator';
import pg from 'pg';
import { type DatabaseHandle, MIGRATIONS_FOLDER, openDatabase } from '../../api/src/db/client';

let template: Promise<Blob> | undefined;

/** Migrates one in-memory PGlite per test process and hands out clones (about 0.5 s each vs 2.5 s cold). */
function migratedTemplate(): Promise<Blob> {
  template ??= (async () => {
    const client = new PGlite();
    await migrate(drizzle(client), { migrationsFolder: MIGRATIONS_FOLDER });
    const dump = await client.dumpDataDir('none');
    await client.close();
    return dump;
  })();
  return template;
}

/** A fresh, fully migrated in-memory database for one test. */
export async function createTestDatabase(): Promise<DatabaseHandle> {
  return openDatabase({ kind: 'pglite-memory', loadDataDir: await migratedTemplate() });
}

/** Empties a PostgreSQL server database, so the committed migrations run from the first one. */
export async function resetPostgresDatabase(url: string): Promise<void> {
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  await admin.query(
    'drop schema if exists public cascade; create schema public; drop schema if exists drizzle cascade;',
  );
  await admin.end();
}
