import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixtureMap, makeBundleFiles, makeTempDir, writeBundleZip } from '../support/bundle-fixtures';
import { replayToEnd } from '../support/replay-runs';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let auth: { Authorization: string };
let bundleId: string;
let otherBundleId: string;
let replayId: string;
let steps: number;

async function upload(caseId: string, zip: string): Promise<string> {
  const res = await request(t.app).post(`/api/cases/${caseId}/bundles`).set(auth).attach('bundle', zip);
  return res.body.bundle.id;
}

beforeAll(async () => {
  t = await createTestApp();
  const token = await t.tokenFor('investigator');
  auth = { Authorization: `Bearer ${token}` };
  const cases = await request(t.app).get('/api/cases').set(auth);
  const caseId = cases.body.items[0].id;
  const dir = await makeTempDir('driftcase-views-');
  bundleId = await upload(
    caseId,
    await writeBundleZip(path.join(dir, 'a.zip'), makeBundleFiles({ steps: 12 })),
  );
  otherBundleId = await upload(
    caseId,
    await writeBundleZip(path.join(dir, 'b.zip'), makeBundleFiles({ steps: 13 })),
  );
  const replay = await replayToEnd(t.app, token, bundleId);
  replayId = replay.id;
  steps = replay.steps ?? 0;
}, 60_000);

afterAll(() => t?.close());

describe('workspace views of a bundle', () => {
  it('serves map.json as recorded, with the manifest footprint', async () => {
    const res = await request(t.app).get(`/api/bundles/${bundleId}/map`).set(auth).expect(200);
    const recorded = fixtureMap() as { rows: string[]; width: number; height: number; resolution: number };
    expect(res.body.rows).toEqual(recorded.rows);
    expect(res.body.width).toBe(recorded.width);
    expect(res.body.resolution).toBe(recorded.resolution);
    expect(res.body.footprint.shape).toMatch(/circle|rectangle/);
  });

  it('serves tracks with odometry speed and the manifest filter block', async () => {
    const res = await request(t.app).get(`/api/bundles/${bundleId}/tracks`).set(auth).expect(200);
    expect(res.body.speed.t.length).toBe(res.body.speed.speed.length);
    expect(res.body.filter.particles).toBeGreaterThan(0);
    expect(Array.isArray(res.body.events)).toBe(true);
  });

  it('gives one clearance per replay step, and refuses a replay of another bundle', async () => {
    const res = await request(t.app)
      .get(`/api/bundles/${bundleId}/replays/${replayId}/clearance`)
      .set(auth)
      .expect(200);
    expect(res.body.clearance).toHaveLength(steps);
    expect(res.body.footprintReach).toBeGreaterThan(0);
    const wrong = await request(t.app)
      .get(`/api/bundles/${otherBundleId}/replays/${replayId}/clearance`)
      .set(auth)
      .expect(404);
    expect(wrong.body.error.message).toContain(replayId);
  });

  it('names a malformed id as the bad input', async () => {
    const res = await request(t.app).get('/api/bundles/not-a-uuid/map').set(auth).expect(400);
    expect(JSON.stringify(res.body.error)).toContain('Bundle id must be a UUID');
  });
});
