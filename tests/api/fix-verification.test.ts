import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEntries, bundles, replays, users } from '../../api/src/db/schema';
import type { TReplay, TReplayFlag } from '../../shared/contracts/replays';
import { readZipEntries } from '../archive/rewrite-zip';
import { archivedCase, downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as, createCase } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

const critical: TReplayFlag = {
  kind: 'belief_collapse',
  start: 4,
  end: 6,
  severity: 'critical',
  evidence: 'ESS 12 / 2000',
};

interface ReplayFacts {
  flags: TReplayFlag[];
  metrics: TReplay['metrics'];
  overrides?: Record<string, unknown>;
}

/**
 * A case with a bundle, a finished incident replay and a fix whose verification replay has the
 * given outcome. The replay rows are written directly (a factory), so their metrics are exactly
 * the numbers each check needs.
 */
async function caseWithVerifiedReplay(original: ReplayFacts, verification: ReplayFacts) {
  const caseId = await createCase(t);
  const db = t.database.db;
  const [engineer] = await db.select().from(users).where(eq(users.email, 'engineer@driftcase.example'));
  const bundleId = randomUUID();
  await db.insert(bundles).values({
    id: bundleId,
    caseId,
    sha256: randomUUID().replaceAll('-', ''),
    sizeBytes: 1,
    originalName: 'dock-4.zip',
    uploadedBy: engineer.id,
    status: 'valid',
  });
  const insertReplay = async (facts: ReplayFacts, createdAt: Date) => {
    const id = randomUUID();
    await db.insert(replays).values({
      id,
      bundleId,
      status: 'done',
      overrides: facts.overrides ?? {},
      flags: facts.flags,
      metrics: facts.metrics,
      createdBy: engineer.id,
      createdAt,
    });
    return id;
  };
  await insertReplay(original, new Date('2026-03-14T09:00:00Z'));
  const verificationReplayId = await insertReplay(
    { overrides: { particles: 3000 }, ...verification },
    new Date('2026-03-14T10:00:00Z'),
  );
  const fix = await as(t, 'engineer').post(`/api/cases/${caseId}/fixes`, {
    url: 'https://tracker.harbourline.example/CR-301',
    description: 'Map of dock 4 rebuilt after the rack move',
    verificationReplayId,
  });
  expect(fix.status).toBe(201);
  return { caseId, fixId: fix.body.id as string };
}

const before: ReplayFacts = {
  flags: [critical, critical],
  metrics: { rmse_reference: 0.42, rmse_onboard: 0.3, diverged_at: 12.5 },
};
const better: ReplayFacts = {
  flags: [],
  metrics: { rmse_reference: 0.04, rmse_onboard: 0.3, diverged_at: null },
};

async function verifyAuditPayloads(caseId: string) {
  const rows = await t.database.db.select().from(auditEntries).where(eq(auditEntries.caseId, caseId));
  return rows.filter((row) => row.action === 'fix.verify').map((row) => row.details);
}

describe('marking a fix verified', () => {
  it('refuses without a comment, in plain words naming the field (issue #12)', async () => {
    const { caseId, fixId } = await caseWithVerifiedReplay(before, better);
    for (const body of [{}, { comment: '  ' }]) {
      const res = await as(t, 'reviewer').post(`/api/cases/${caseId}/fixes/${fixId}/verify`, body);
      expect(res.status).toBe(400);
      expect(JSON.stringify(res.body.error)).toMatch(/comment/i);
      expect(JSON.stringify(res.body.error)).not.toMatch(/expected string|received undefined/);
    }
    const fixes = await as(t, 'reviewer').get(`/api/cases/${caseId}/fixes`);
    expect(fixes.body.items[0].verifiedAt).toBeNull();
    expect(await verifyAuditPayloads(caseId)).toEqual([]);
  });

  it('stores the comment with the verification and in its audit entry', async () => {
    const { caseId, fixId } = await caseWithVerifiedReplay(before, better);
    const comment = 'Checked the verification replay: no belief collapse at the rack.';
    const res = await as(t, 'reviewer').post(`/api/cases/${caseId}/fixes/${fixId}/verify`, { comment });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ verificationComment: comment, isVerifiedWithoutImprovement: false });
    const listed = await as(t, 'investigator').get(`/api/cases/${caseId}/fixes`);
    expect(listed.body.items[0].verificationComment).toBe(comment);
    expect(await verifyAuditPayloads(caseId)).toEqual([
      expect.objectContaining({ comment, outcome: 'improved' }),
    ]);
  });

  it("puts the verifier's comment in the evidence archive's report", async () => {
    const { caseId } = await archivedCase(t);
    const [fix] = (await as(t, 'reviewer').get(`/api/cases/${caseId}/fixes`)).body.items;
    const comment = 'Only one replay of this bundle, so nothing to compare; checked the scans by eye.';
    const verified = await as(t, 'reviewer').post(`/api/cases/${caseId}/fixes/${fix.id}/verify`, {
      comment,
      confirmWithoutImprovement: true,
    });
    expect(verified.status).toBe(200);
    const archive = await downloadArchive(t, caseId, await makeTempDir('driftcase-fix-archive-'));
    const report = (await readZipEntries(archive)).get('report.html')?.toString('utf8') ?? '';
    expect(report).toContain(`“${comment}”`);
    expect(report).toContain('confirmed although the replay showed no improvement');
  });

  it('asks for an explicit confirmation when the verification replay did not improve', async () => {
    const { caseId, fixId } = await caseWithVerifiedReplay(before, before);
    const url = `/api/cases/${caseId}/fixes/${fixId}/verify`;
    const refused = await as(t, 'investigator').post(url, { comment: 'Looks the same to me.' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toMatch(/did not improve/);
    expect(refused.body.error.message).toMatch(/confirmWithoutImprovement/);
    expect(await verifyAuditPayloads(caseId)).toEqual([]);

    const confirmed = await as(t, 'investigator').post(url, {
      comment: 'Same flags; the fix is a procedure change the replay cannot show.',
      confirmWithoutImprovement: true,
    });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body.isVerifiedWithoutImprovement).toBe(true);
    expect(await verifyAuditPayloads(caseId)).toEqual([
      expect.objectContaining({ outcome: 'not_improved', confirmedWithoutImprovement: true }),
    ]);
  });

  it('asks for the confirmation too when no verification replay is linked', async () => {
    const caseId = await createCase(t);
    const fix = await as(t, 'engineer').post(`/api/cases/${caseId}/fixes`, {
      commitId: '3f9c2ab',
      description: 'Procedure change only',
    });
    const url = `/api/cases/${caseId}/fixes/${fix.body.id}/verify`;
    const refused = await as(t, 'reviewer').post(url, { comment: 'Procedure checked on site.' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.message).toMatch(/no finished verification replay/);
    const confirmed = await as(t, 'reviewer').post(url, {
      comment: 'Procedure checked on site.',
      confirmWithoutImprovement: true,
    });
    expect(confirmed.status).toBe(200);
  });
});
