import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { zipFolder } from '../../api/src/bundles/zip-folder';
import type { TReplay } from '../../shared/contracts/replays';
import { readZipEntries } from '../archive/rewrite-zip';
import { downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as, createCase, SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import { replayToEnd } from '../support/replay-runs';
import { createTestApp, type TestApp } from '../support/test-app';

// Findings cite a probable cause by the replay's digest and the cause's kind. The wheel-slip
// sample injects a wheel slip (sample-logs/catalog.json), so its replay has an odometry fault.
let t: TestApp;
let caseId: string;
let replay: TReplay;

beforeAll(async () => {
  t = await createTestApp();
  caseId = await createCase(t, 'Wheel slip by the drain');
  const dir = await makeTempDir('driftcase-cause-cite-');
  const zip = await zipFolder(path.resolve('sample-logs/wheel-slip'), path.join(dir, 'wheel-slip.zip'));
  const token = await t.tokenFor('investigator');
  const uploaded = await request(t.app)
    .post(`/api/cases/${caseId}/bundles`)
    .set('Authorization', `Bearer ${token}`)
    .attach('bundle', zip);
  expect(uploaded.status).toBe(201);
  const done = await replayToEnd(t.app, token, uploaded.body.bundle.id, { overrides: { particles: 300 } });
  replay = (await as(t, 'investigator').get(`/api/replays/${done.id}`)).body;
}, 240_000);
afterAll(() => t.close());

const submitCiting = async (kind: string) => {
  const draft = {
    ...SAMPLE_FINDINGS,
    evidence: [{ type: 'cause', replayId: replay.id, digest: replay.digest, kind }],
  };
  const saved = await as(t, 'investigator').put(`/api/cases/${caseId}/findings`, draft);
  expect(saved.status).toBe(200);
  return as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
};

describe('a finding that cites a probable cause', () => {
  it('is refused, naming the field, when the replay has no cause of that kind', async () => {
    const kinds = (replay.causes ?? []).map((cause) => cause.kind);
    expect(kinds).not.toContain('sensor_degraded');
    const res = await submitCiting('sensor_degraded');
    expect(res.status).toBe(400);
    expect(res.body.error.details).toEqual([
      expect.objectContaining({
        path: 'evidence.0.kind',
        message: expect.stringMatching(/no probable cause/),
      }),
    ]);
  });

  it('is accepted for a cause the replay found, and the report names it', async () => {
    expect(replay.causes?.[0]?.kind).toBe('odometry_fault');
    expect((await submitCiting('odometry_fault')).status).toBe(201);
    const file = await downloadArchive(t, caseId, await makeTempDir('driftcase-cause-report-'));
    const report = (await readZipEntries(file)).get('report.html')?.toString('utf8') ?? '';
    expect(report).toContain('Probable cause: Odometry fault');
    expect(report).toContain(replay.digest ?? 'no digest');
  }, 120_000);
});
