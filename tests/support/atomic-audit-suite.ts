import path from 'node:path';
import { and, count, eq, gt, max, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEntries, cases, findingVersions, users } from '../../api/src/db/schema';
import { makeBundleFiles, makeTempDir, writeBundleZip } from './bundle-fixtures';
import { as, caseWithDraft, createCase, createPerson } from './case-work-fixtures';
import type { TestApp } from './test-app';

/**
 * A write and its audit entry commit together or not at all, on whichever database `open` gives
 * (PGlite in tests/api/, PostgreSQL in tests/pg/). Failures are injected with triggers, so the
 * database itself refuses the audit row or the write, as a full disk or a broken column would.
 */
export function describeAtomicAudit(database: string, open: () => Promise<TestApp>) {
  describe(`atomic audit on ${database}`, () => {
    let t: TestApp;
    beforeAll(async () => {
      t = await open();
      // Sign in first: sign-ins are audited, and some tests below make every audit insert fail.
      for (const role of ['investigator', 'reviewer', 'admin'] as const) await t.tokenFor(role);
    });
    afterAll(() => t.close());

    const lastId = async () =>
      (await t.database.db.select({ last: max(auditEntries.id) }).from(auditEntries))[0]?.last ?? 0;
    const entriesAfter = (id: number) =>
      t.database.db.select().from(auditEntries).where(gt(auditEntries.id, id)).orderBy(auditEntries.id);
    const caseRow = async (id: string) =>
      (await t.database.db.select().from(cases).where(eq(cases.id, id)))[0];
    const engineer = async () =>
      (await t.database.db.select().from(users).where(eq(users.email, 'engineer@driftcase.example')))[0];

    /** Makes every insert into (or update of) `table` fail until the returned function runs. */
    async function refuse(table: 'audit_entries' | 'cases', operation: 'insert' | 'update') {
      const db = t.database.db;
      await db.execute(
        sql.raw(`create or replace function driftcase_test_refuse() returns trigger language plpgsql as $$
          begin raise exception 'refused by a test trigger on %', TG_TABLE_NAME; end $$`),
      );
      await db.execute(
        sql.raw(
          `create trigger driftcase_test_refuse before ${operation} on ${table} for each row execute function driftcase_test_refuse()`,
        ),
      );
      return () => db.execute(sql.raw(`drop trigger driftcase_test_refuse on ${table}`));
    }

    it('refuses PATCH /api/cases/:id with a NUL key (400, nothing changed, no entry); a clean edit commits with its entry', async () => {
      const caseId = await createCase(t);
      const before = await lastId();
      const attack = await as(t, 'investigator').patch(`/api/cases/${caseId}`, {
        summary: 'silent edit',
        '\u0000': 1,
      });
      expect(attack.status).toBe(400);
      expect(attack.body.error.details).toEqual([expect.objectContaining({ path: '\\u0000' })]);
      expect((await caseRow(caseId)).summary).toBe('');
      expect(await entriesAfter(before)).toEqual([]);

      const edit = await as(t, 'investigator').patch(`/api/cases/${caseId}`, { summary: 'visible edit' });
      expect(edit.status).toBe(200);
      // Read at once: the entry committed with the edit, before the answer was sent.
      const entries = await entriesAfter(before);
      expect(entries.map((e) => [e.action, e.details])).toEqual([['case.update', { fields: ['summary'] }]]);
      expect((await caseRow(caseId)).summary).toBe('visible edit');
    });

    it('refuses a role change with a NUL key in PATCH /api/users/:id; a clean one commits with its entry', async () => {
      const target = await engineer();
      const before = await lastId();
      const attack = await as(t, 'admin').patch(`/api/users/${target.id}`, { role: 'reviewer', '\u0000': 1 });
      expect(attack.status).toBe(400);
      expect((await engineer()).role).toBe('engineer');
      expect(await entriesAfter(before)).toEqual([]);

      const change = await as(t, 'admin').patch(`/api/users/${target.id}`, { role: 'legal' });
      expect(change.status).toBe(200);
      const entries = await entriesAfter(before);
      expect(entries.map((e) => [e.action, e.targetId, e.details])).toEqual([
        ['user.update', target.id, { fields: ['role'], role: 'legal' }],
      ]);
      await as(t, 'admin').patch(`/api/users/${target.id}`, { role: 'engineer' });
    });

    it('refuses a transition comment containing NUL; a clean comment is in the entry', async () => {
      const caseId = await createCase(t);
      const before = await lastId();
      const attack = await as(t, 'investigator').post(`/api/cases/${caseId}/transitions`, {
        to: 'analysing',
        comment: 'moved \u0000 quietly',
      });
      expect(attack.status).toBe(400);
      expect(attack.body.error.details[0].path).toBe('comment');
      expect((await caseRow(caseId)).status).toBe('open');
      expect(await entriesAfter(before)).toEqual([]);

      const move = await as(t, 'investigator').post(`/api/cases/${caseId}/transitions`, {
        to: 'analysing',
        comment: 'Bundle expected tomorrow',
      });
      expect(move.status).toBe(200);
      const [entry] = await entriesAfter(before);
      expect(entry).toMatchObject({
        action: 'case.transition',
        details: { from: 'open', to: 'analysing', comment: 'Bundle expected tomorrow' },
      });
    });

    it('rolls the write back and answers audit_failed when the audit entry cannot be stored', async () => {
      const caseId = await createCase(t);
      const target = await engineer();
      // Someone not yet on the case, so adding them is a write of its own.
      const newcomer = await createPerson(t, {
        email: 'atomic.newcomer@driftcase.example',
        name: 'Tomasz Okafor',
        role: 'investigator',
        password: 'long-enough-password',
      });
      const membersBefore = (await as(t, 'investigator').get(`/api/cases/${caseId}/members`)).body;
      const [{ casesBefore }] = await t.database.db.select({ casesBefore: count() }).from(cases);
      const allow = await refuse('audit_entries', 'insert');
      try {
        const calls = [
          await as(t, 'investigator').patch(`/api/cases/${caseId}`, { summary: 'unrecorded edit' }),
          await as(t, 'admin').patch(`/api/users/${target.id}`, { role: 'reviewer' }),
          await as(t, 'investigator').post(`/api/cases/${caseId}/transitions`, { to: 'analysing' }),
          await as(t, 'investigator').post('/api/cases', {
            title: 'Unrecorded case',
            site: 'Yard',
            robotId: 'R-2',
            incidentTime: '2026-10-03T06:41:00Z',
            severity: 'low',
          }),
          await as(t, 'investigator').post(`/api/cases/${caseId}/members`, { userId: newcomer.id }),
        ];
        for (const res of calls) {
          expect(res.status).toBe(500);
          expect(res.body.error.code).toBe('audit_failed');
          expect(res.body.error.message).toMatch(/^Nothing was saved: the audit entry for this action/);
        }
      } finally {
        await allow();
      }
      const row = await caseRow(caseId);
      expect([row.summary, row.status]).toEqual(['', 'open']);
      expect((await engineer()).role).toBe('engineer');
      const [{ casesAfter }] = await t.database.db.select({ casesAfter: count() }).from(cases);
      expect(casesAfter).toBe(casesBefore);
      expect((await as(t, 'investigator').get(`/api/cases/${caseId}/members`)).body).toEqual(membersBefore);
    });

    it('leaves no entry and no half-done write when the write itself fails', async () => {
      const caseId = await caseWithDraft(t);
      const before = await lastId();
      // Submitting stores a version, then moves the case; the move is made to fail.
      const allow = await refuse('cases', 'update');
      let res: request.Response;
      try {
        res = await as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
      } finally {
        await allow();
      }
      expect(res.status).toBe(500);
      const versions = await t.database.db
        .select({ versions: count() })
        .from(findingVersions)
        .where(eq(findingVersions.caseId, caseId));
      expect(versions[0].versions).toBe(0);
      expect(await entriesAfter(before)).toEqual([]);
      expect((await caseRow(caseId)).status).toBe('analysing');

      const retry = await as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
      expect(retry.status).toBe(201);
      expect((await entriesAfter(before)).map((e) => e.action)).toEqual(['findings.submit']);
    });

    it('moves a case into analysis within the upload that starts it, audited with its cause', async () => {
      const caseId = await createCase(t);
      const zip = await writeBundleZip(
        path.join(await makeTempDir('driftcase-atomic-'), 'first.zip'),
        makeBundleFiles({ steps: 12 }),
      );
      const before = await lastId();
      const token = await t.tokenFor('investigator');
      const res = await request(t.app)
        .post(`/api/cases/${caseId}/bundles`)
        .set('Authorization', `Bearer ${token}`)
        .attach('bundle', zip);
      expect(res.status).toBe(201);
      const entries = await entriesAfter(before);
      expect(entries.map((e) => [e.action, (e.details as { cause?: string }).cause ?? null])).toEqual([
        // Received (row and original recorded before reading), then validated, then the case moves.
        ['bundle.receive', null],
        ['bundle.upload', null],
        ['case.transition', 'bundle.upload'],
      ]);
      expect((await caseRow(caseId)).status).toBe('analysing');
      const caseEntries = await t.database.db
        .select({ n: count() })
        .from(auditEntries)
        .where(and(eq(auditEntries.caseId, caseId), eq(auditEntries.action, 'case.transition')));
      expect(caseEntries[0].n).toBe(1);
    });
  });
}
