import pg from 'pg';
import { openDatabase } from '../../api/src/db/client';
import { auditTriggerStartupSuite } from '../support/audit-trigger-suite';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL=postgres://... to run the PostgreSQL suite.');

auditTriggerStartupSuite(async () => {
  // An empty server database each time, so the committed migrations run from the first one.
  const admin = new pg.Client({ connectionString: url });
  await admin.connect();
  await admin.query(
    'drop schema if exists public cascade; create schema public; drop schema if exists drizzle cascade;',
  );
  await admin.end();
  return openDatabase({ kind: 'postgres', url });
});
