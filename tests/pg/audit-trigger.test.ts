import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type DatabaseHandle, openDatabase } from '../../api/src/db/client';
import { createAuditService } from '../../api/src/services/audit/audit-service';

/** The append-only trigger and the per-chain advisory lock on a real PostgreSQL server. */
const url = process.env.DATABASE_URL;
if (!url) throw new Error('Set DATABASE_URL=postgres://... to run the PostgreSQL suite.');

let handle: DatabaseHandle;
let client: pg.Client;

beforeAll(async () => {
  client = new pg.Client({ connectionString: url });
  await client.connect();
  await client.query(
    'drop schema if exists public cascade; create schema public; drop schema if exists drizzle cascade;',
  );
  handle = await openDatabase({ kind: 'postgres', url });
});
afterAll(async () => {
  await client?.end();
  await handle?.close();
});

describe('audit trail on PostgreSQL', () => {
  it('keeps one gap-free chain under concurrent appends', async () => {
    const audit = createAuditService({ db: handle.db });
    await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        audit.appendAlone({
          actor: null,
          action: 'archive.verify',
          targetType: 'test',
          targetId: String(i),
          payload: { i },
        }),
      ),
    );
    expect(await audit.verifyGlobalChain()).toEqual({ ok: true, entries: 20 });
  });

  it('raises on UPDATE, DELETE and TRUNCATE of audit rows', async () => {
    await expect(client.query("update audit_entries set action = 'x'")).rejects.toMatchObject({
      code: '42501',
    });
    await expect(client.query('delete from audit_entries')).rejects.toMatchObject({ code: '42501' });
    await expect(client.query('truncate audit_entries')).rejects.toMatchObject({ code: '42501' });
  });

  it('detects a row changed with the trigger disabled by the table owner', async () => {
    await client.query('alter table audit_entries disable trigger user');
    await client.query(
      "update audit_entries set payload_sha256 = repeat('0', 64) where chain = 'global' and chain_seq = 7",
    );
    await client.query('alter table audit_entries enable trigger user');
    const report = await createAuditService({ db: handle.db }).verifyGlobalChain();
    expect(report).toMatchObject({ ok: false, firstBroken: { chainSeq: 7 } });
  });
});
