import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBundleFiles, writeBundleZip } from '../support/bundle-fixtures';
import { type CaseTestbed, createCaseTestbed } from '../support/case-testbed';

// The developer wordings are quoted from what users saw (zod 4's English locale); the API's error
// details must carry the shared plain sentences instead, field by field.
const DEVELOPER_WORDING =
  /Invalid option|Invalid input|expected string|received undefined|Too small|expected number|>=|must be true/;

let bed: CaseTestbed;
let bundleId: string;
const auth = () => ({ Authorization: `Bearer ${bed.token}` });

beforeAll(async () => {
  bed = await createCaseTestbed();
  const zip = await writeBundleZip(path.join(bed.dir, 'plain.zip'), makeBundleFiles({ steps: 20, beams: 9 }));
  const res = await request(bed.t.app)
    .post(`/api/cases/${bed.caseId}/bundles`)
    .set(auth())
    .attach('bundle', zip);
  bundleId = res.body.bundle.id;
});
afterAll(() => bed.close());

describe('API validation errors in plain words', () => {
  it('refuses more beams than the bundle’s scanner has, beside overrides.beams_used, naming the limit', async () => {
    const res = await request(bed.t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { beams_used: 9999 } })
      .expect(400);
    const issue = res.body.error.details.find((d: { path: string }) => d.path === 'overrides.beams_used');
    // The fixture's scanner has 9 beams (makeBundleFiles({ beams: 9 })).
    expect(issue.message).toMatch(/9 or less/);
  });

  it('states a particle count below 1 and a missing case field as sentences', async () => {
    const replay = await request(bed.t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { particles: 0 } })
      .expect(400);
    expect(replay.body.error.details[0]).toMatchObject({
      path: 'overrides.particles',
      message: 'This must be 1 or more',
    });
    const created = await request(bed.t.app).post('/api/cases').set(auth()).send({}).expect(400);
    for (const detail of created.body.error.details) expect(detail.message).not.toMatch(DEVELOPER_WORDING);
    expect(created.body.error.details.find((d: { path: string }) => d.path === 'title').message).toBe(
      'This is required',
    );
  });

  it('names the choices of an enum as words', async () => {
    const res = await request(bed.t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { resampling_method: 'best' } })
      .expect(400);
    const message = res.body.error.details[0].message as string;
    expect(message).not.toMatch(DEVELOPER_WORDING);
    expect(message).toMatch(/^Choose one of: .*systematic/);
  });
});
