import { openDatabase } from '../../api/src/db/client';
import { describeAtomicAudit } from '../support/atomic-audit-suite';
import { createTestApp } from '../support/test-app';
import { resetPostgresDatabase } from '../support/test-database';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL=postgres://... to run the PostgreSQL suite.');

describeAtomicAudit('PostgreSQL', async () => {
  await resetPostgresDatabase(url);
  return createTestApp({}, { database: await openDatabase({ kind: 'postgres', url }) });
});
