import { createHash } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { canonicalJson } from '../../shared/canonical-json';
import { as, signedCase } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

describe('audit trail', () => {
  it('records each write in the case chain, and the chain verifies', async () => {
    const { caseId } = await signedCase(t);
    const list = await as(t, 'legal').get(`/api/cases/${caseId}/audit`);
    expect(list.body.items.map((e: { action: string }) => e.action)).toEqual([
      'case.create',
      // The creator puts the reviewer, engineer and legal on the case (case-work-fixtures).
      'case.member_add',
      'case.member_add',
      'case.member_add',
      'findings.save',
      // The first draft starts analysis; that move is audited with its cause.
      'case.transition',
      'findings.submit',
      'findings.signoff',
    ]);
    expect(list.body.items[5].details).toMatchObject({
      from: 'open',
      to: 'analysing',
      cause: 'findings.save',
    });
    const first = list.body.items[0];
    expect(first.prevHash).toBe('0'.repeat(64));
    // entry_hash is SHA-256 over the RFC 8785 text of the entry without its own hash (Node crypto as reference).
    const { id: _id, entryHash, ...rest } = first;
    expect(createHash('sha256').update(canonicalJson(rest)).digest('hex')).toBe(entryHash);
    expect((await as(t, 'reviewer').get(`/api/cases/${caseId}/audit/verify`)).body).toEqual({
      ok: true,
      entries: 8,
      // No export or daily run has signed a checkpoint of this chain yet.
      checkpoints: { checked: 0, problems: [] },
    });
  });

  it('refuses UPDATE and DELETE of audit rows in the database', async () => {
    await expect(t.database.db.execute(sql`update audit_entries set action = 'x'`)).rejects.toMatchObject({
      cause: { code: '42501' },
    });
    await expect(t.database.db.execute(sql`delete from audit_entries`)).rejects.toThrow();
  });

  it('finds an edited payload hash and a deleted row at the right entry', async () => {
    const { caseId } = await signedCase(t);
    const chain = `case:${caseId}`;
    await t.database.db.execute(sql`alter table audit_entries disable trigger user`);
    await t.database.db.execute(
      sql`update audit_entries set payload_sha256 = ${'f'.repeat(64)} where chain = ${chain} and chain_seq = 3`,
    );
    let report = (await as(t, 'admin').get(`/api/cases/${caseId}/audit/verify`)).body;
    expect(report.ok).toBe(false);
    expect(report.firstBroken.chainSeq).toBe(3);

    const other = await signedCase(t);
    await t.database.db.execute(
      sql`delete from audit_entries where chain = ${`case:${other.caseId}`} and chain_seq = 2`,
    );
    await t.database.db.execute(sql`alter table audit_entries enable trigger user`);
    report = (await as(t, 'admin').get(`/api/cases/${other.caseId}/audit/verify`)).body;
    expect(report).toMatchObject({ ok: false, entries: 7, firstBroken: { chainSeq: 3 } });
  });
});
