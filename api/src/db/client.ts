import fs from 'node:fs';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { drizzle as drizzlePg } from 'drizzle-orm/node-postgres';
import { migrate as migratePg } from 'drizzle-orm/node-postgres/migrator';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import { drizzle as drizzlePglite } from 'drizzle-orm/pglite';
import { migrate as migratePglite } from 'drizzle-orm/pglite/migrator';
import pg from 'pg';
import { PROJECT_ROOT } from '../config';
import * as schema from './schema';

/** The one database type the services see, whichever driver is underneath. */
export type Database = PgDatabase<PgQueryResultHKT, typeof schema>;

/**
 * An open transaction. Functions that write take one, so a write and its audit entry commit
 * together; read helpers take `Database`, which a transaction also is. Inside a transaction use
 * only `tx`: on PGlite a query on `db` waits for the transaction to end, so it never returns.
 */
export type Transaction = Parameters<Parameters<Database['transaction']>[0]>[0];

export interface DatabaseHandle {
  db: Database;
  kind: 'pglite' | 'postgres';
  close(): Promise<void>;
}

export const MIGRATIONS_FOLDER = path.join(PROJECT_ROOT, 'api', 'src', 'db', 'migrations');

export type DatabaseTarget =
  | { kind: 'pglite-dir'; dataDir: string }
  | { kind: 'pglite-memory'; loadDataDir?: Blob | File }
  | { kind: 'postgres'; url: string };

/** Opens the database and applies every committed migration, so a new data directory is ready to use. */
export async function openDatabase(target: DatabaseTarget): Promise<DatabaseHandle> {
  if (target.kind === 'postgres') {
    const pool = new pg.Pool({ connectionString: target.url, max: 10 });
    const db = drizzlePg(pool, { schema }) as unknown as Database;
    await migratePg(db as never, { migrationsFolder: MIGRATIONS_FOLDER });
    return { db, kind: 'postgres', close: () => pool.end() };
  }
  let client: PGlite;
  if (target.kind === 'pglite-dir') {
    // PGlite does not create missing parent folders.
    fs.mkdirSync(target.dataDir, { recursive: true });
    client = new PGlite(target.dataDir);
  } else {
    client = new PGlite(target.loadDataDir ? { loadDataDir: target.loadDataDir } : undefined);
  }
  const db = drizzlePglite(client, { schema }) as unknown as Database;
  await migratePglite(db as never, { migrationsFolder: MIGRATIONS_FOLDER });
  return { db, kind: 'pglite', close: () => client.close() };
}
