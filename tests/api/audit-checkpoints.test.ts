import fs from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyArchive } from '../../api/src/archive/verify-archive';
import { type AuditChainEntry, computeAuditEntryHash, GENESIS_HASH } from '../../shared/audit-chain';
import { downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as, caseWithDraft } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let dataDir: string;
let dir: string;
let caseId: string;
let before: string;

const checkpointFile = () => path.join(dataDir, 'audit', 'checkpoints.jsonl');
const rows = async (query: ReturnType<typeof sql>) => {
  const result = await t.database.db.execute(query);
  return ((result as { rows?: unknown[] }).rows ?? result) as Record<string, unknown>[];
};

/** An insider with database rights: switches the trigger off, edits a row, re-chains the rest. */
async function editAndRechain(chain: string, seq: number, actorEmail: string) {
  const db = t.database.db;
  await db.execute(sql`alter table audit_entries disable trigger audit_entries_no_update_or_delete`);
  const entries = (await t.app.locals.services.audit.readChain(chain)) as AuditChainEntry[];
  let prev = GENESIS_HASH;
  for (const entry of entries) {
    const edited = {
      ...entry,
      actorEmail: entry.chainSeq === seq ? actorEmail : entry.actorEmail,
      prevHash: prev,
    };
    const { entryHash: _old, id: _id, ...unhashed } = edited;
    const entryHash = computeAuditEntryHash(unhashed);
    await db.execute(
      sql`update audit_entries set actor_email = ${edited.actorEmail}, prev_hash = ${prev}, entry_hash = ${entryHash} where chain = ${chain} and chain_seq = ${entry.chainSeq}`,
    );
    prev = entryHash;
  }
  await db.execute(sql`alter table audit_entries enable trigger audit_entries_no_update_or_delete`);
}

beforeAll(async () => {
  dataDir = await makeTempDir('driftcase-checkpoints-');
  dir = await makeTempDir('driftcase-checkpoint-archives-');
  t = await createTestApp({ DATA_DIR: dataDir });
  caseId = await caseWithDraft(t);
  before = await downloadArchive(t, caseId, dir, 'before.zip');
}, 120_000);
afterAll(() => t.close());

describe('signed checkpoints of the audit chain heads', () => {
  it('are appended to a file under DATA_DIR at every export and mailed to legal', async () => {
    const lines = fs.readFileSync(checkpointFile(), 'utf8').trim().split('\n');
    const payloads = lines.map((line) =>
      JSON.parse(Buffer.from(line.split('.')[1], 'base64url').toString('utf8')),
    );
    const ofCase = payloads.find((p) => p.chain === `case:${caseId}`);
    expect(ofCase).toMatchObject({ reason: 'export' });
    const [head] = await rows(
      sql`select chain_seq, entry_hash from audit_entries where chain = ${`case:${caseId}`} order by chain_seq desc limit 1`,
    );
    expect(ofCase.chainSeq).toBe(Number(head.chain_seq));
    expect(ofCase.entryHash).toBe(head.entry_hash);
    const mail = await rows(
      sql`select "to", subject, text from mail_queue where subject like '%audit trail checkpoint%'`,
    );
    expect(mail.length).toBeGreaterThan(0);
    expect(JSON.stringify(mail[0].to)).toContain('legal@driftcase.example');
    expect(String(mail[0].text)).toContain(lines[0]);
  });

  it('report an insider edit that was re-chained, which the hash chain alone no longer shows', async () => {
    const chain = `case:${caseId}`;
    expect((await as(t, 'legal').get(`/api/cases/${caseId}/audit/verify`)).body.ok).toBe(true);
    await editAndRechain(chain, 1, 'someone-else@driftcase.example');
    const res = await as(t, 'legal').get(`/api/cases/${caseId}/audit/verify`);
    expect(res.body.entries).toBeGreaterThan(1);
    expect(res.body.ok).toBe(false);
    expect(res.body.checkpoints.problems.join('\n')).toMatch(
      /entry \d+ is not the one checkpointed .*re-chained/,
    );
  });

  it('make an archive exported after the edit fail verification, while the earlier one still passes', async () => {
    const after = await downloadArchive(t, caseId, dir, 'after.zip');
    const verify = async (file: string) =>
      (
        await request(t.app)
          .post('/api/archives/verify')
          .set('Authorization', `Bearer ${await t.tokenFor('legal')}`)
          .attach('archive', file)
          .expect(200)
      ).body;
    expect((await verify(before)).ok).toBe(true);
    const refused = await verify(after);
    expect(refused.ok).toBe(false);
    expect(refused.checks).toContainEqual(
      expect.objectContaining({
        kind: 'checkpoint',
        ok: false,
        message: expect.stringMatching(/re-chained/),
      }),
    );
    // Offline, with the checkpoint copy legal kept: the same verdict.
    const keys = (await request(t.app).get('/api/keys')).body;
    const offline = await verifyArchive(after, {
      skipReplays: true,
      trust: { keys: keys.keys, label: 'published keys' },
      checkpoints: { lines: fs.readFileSync(checkpointFile(), 'utf8').split('\n'), label: 'kept copy' },
    });
    expect(offline.checks.some((c) => c.kind === 'checkpoint' && !c.ok)).toBe(true);
  }, 120_000);
});
