import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { validateBundleFiles } from '../../shared/bundle/validate-bundle-files';
import type { TReplay, TReplayStepResponse } from '../../shared/contracts/replays';
import { DIGEST_LAYOUT, ENGINE_VERSION, replayFromFiles } from '../../shared/engine';
import { findProbableCauses } from '../../shared/engine/causes/find-probable-causes';
import { runReplay } from '../../shared/engine/filter';
import { detectFlags } from '../../shared/engine/flags/detect-flags';
import { resolveReplaySettings } from '../../shared/engine/settings';
import { makeBundleFiles, withFile, writeBundleZip } from '../support/bundle-fixtures';
import { type CaseTestbed, createCaseTestbed } from '../support/case-testbed';
import { waitForReplay } from '../support/replay-runs';

let bed: CaseTestbed;
let t: CaseTestbed['t'];
let token: string;
let caseId: string;
let dir: string;
let dataDir: string;

beforeAll(async () => {
  bed = await createCaseTestbed();
  ({ t, token, caseId, dir, dataDir } = bed);
});
afterAll(() => bed.close());

const auth = () => ({ Authorization: `Bearer ${token}` });

async function uploadBundle(files: Record<string, string>, name: string): Promise<string> {
  const zip = await writeBundleZip(path.join(dir, name), files);
  const res = await request(t.app).post(`/api/cases/${caseId}/bundles`).set(auth()).attach('bundle', zip);
  return res.body.bundle?.id ?? res.body.error.details.bundle.id;
}

const waitForFinish = (id: string): Promise<TReplay> => waitForReplay(t.app, token, id);

describe('replays over the API', () => {
  const files = makeBundleFiles({ steps: 120, beams: 9 });
  let bundleId: string;
  let replay: TReplay;

  beforeAll(async () => {
    bundleId = await uploadBundle(files, 'replay.zip');
    const started = await request(t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({})
      .expect(202);
    expect(started.headers.location).toBe(`/api/replays/${started.body.id}`);
    replay = await waitForFinish(started.body.id);
  });

  it('runs in a worker and gives the same digest as the engine run in-process', () => {
    expect(replay.status).toBe('done');
    const parsed = validateBundleFiles(files);
    if (!parsed.ok) throw new Error('fixture should be valid');
    const settings = resolveReplaySettings(parsed.bundle.manifest);
    if (!settings.ok) throw new Error('fixture settings should resolve');
    const local = runReplay(parsed.bundle, settings.settings);
    expect(replay.digest).toBe(local.digest);
    expect(replay.steps).toBe(120);
  });

  it('splits a replay over the pool threads with the single-thread digest, and records the engine', async () => {
    // 1,500 particles make six chunks, so the pool's helper thread has work to take.
    const started = await request(t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { particles: 1500 } })
      .expect(202);
    const split = await waitForFinish(started.body.id);
    const single = replayFromFiles(files, { particles: 1500 }, { keyframeInterval: 0 });
    expect(split.digest).toBe(single.digest);
    expect(split.engine).toEqual({
      engine: ENGINE_VERSION,
      digestLayout: DIGEST_LAYOUT,
      runtime: `node ${process.version} (V8 ${process.versions.v8})`,
    });
  });

  it('records the upload and the replay in the case audit trail', async () => {
    const admin = await t.tokenFor('admin');
    const audit = await request(t.app)
      .get(`/api/cases/${caseId}/audit?pageSize=100`)
      .set('Authorization', `Bearer ${admin}`)
      .expect(200);
    const actions = audit.body.items.map(
      (e: { action: string; targetId: string }) => `${e.action} ${e.targetId}`,
    );
    expect(actions).toContain(`bundle.upload ${bundleId}`);
    expect(actions).toContain(`replay.start ${replay.id}`);
  });

  it('serves the probable causes on the replay, as the engine finds them in-process, and not in lists', async () => {
    const detail = await request(t.app).get(`/api/replays/${replay.id}`).set(auth()).expect(200);
    // Reference: the same bundle replayed and analysed in this process, outside the server.
    const local = replayFromFiles(files, {}, { keyframeInterval: 0 });
    expect(detail.body.digest).toBe(local.digest);
    const flags = detectFlags({ ...local, context: local.context });
    const expected = JSON.parse(JSON.stringify(findProbableCauses({ ...local, flags })));
    expect(detail.body.causes).toEqual(expected);
    expect(detail.body.causes.length).toBeGreaterThan(0);
    const list = await request(t.app).get(`/api/bundles/${bundleId}/replays`).set(auth()).expect(200);
    expect(list.body.items[0].causes).toBeUndefined();
  });

  it('lists the replay on its bundle and serves the series', async () => {
    const list = await request(t.app).get(`/api/bundles/${bundleId}/replays`).set(auth()).expect(200);
    expect(list.body.items.map((r: TReplay) => r.id)).toContain(replay.id);
    const series = await request(t.app).get(`/api/replays/${replay.id}/series`).set(auth()).expect(200);
    expect(series.body.steps).toBe(120);
    expect(series.body.columns.ess).toHaveLength(120);
    expect(series.body.resamplingThreshold).toBe(0.5);
  });

  it('returns the exact particle set of any step, identical to a full run', async () => {
    const parsed = validateBundleFiles(files);
    if (!parsed.ok) throw new Error('fixture should be valid');
    const settings = resolveReplaySettings(parsed.bundle.manifest);
    if (!settings.ok) throw new Error('fixture settings should resolve');
    // Keyframes at every step are the full run's own particle sets.
    const full = runReplay(parsed.bundle, settings.settings, { keyframeInterval: 1 });
    for (const k of [0, 1, 57, 99, 100, 119]) {
      const res = await request(t.app).get(`/api/replays/${replay.id}/steps/${k}`).set(auth()).expect(200);
      const step = res.body as TReplayStepResponse;
      const expected = full.keyframes[k];
      expect(step.count).toBe(expected.count);
      expect(step.x).toEqual(Array.from(expected.x));
      expect(step.theta).toEqual(Array.from(expected.theta));
      expect(step.weight.reduce((a, b) => a + b, 0)).toBeCloseTo(1, 9);
    }
    await request(t.app).get(`/api/replays/${replay.id}/steps/120`).set(auth()).expect(404);
    await request(t.app).get(`/api/replays/${replay.id}/steps/-1`).set(auth()).expect(400);
  });

  it('streams progress as server-sent events and ends with the final state', async () => {
    const started = await request(t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { seed: 11 } });
    const res = await request(t.app)
      .get(`/api/replays/${started.body.id}/progress`)
      .set(auth())
      .buffer(true)
      .parse((response, done) => {
        let text = '';
        response.on('data', (chunk: Buffer) => {
          text += chunk.toString();
        });
        response.on('end', () => done(null, text));
      })
      .expect(200);
    expect(res.headers['content-type']).toContain('text/event-stream');
    const text = res.body as string;
    expect(text).toMatch(/event: finished/);
    const finished = JSON.parse(text.split('event: finished\ndata: ')[1].split('\n')[0]);
    expect(finished.status).toBe('done');
    expect(finished.digest).not.toBe(replay.digest);
  });

  it('validates overrides and names the field', async () => {
    const res = await request(t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { particles: 0, resampling_method: 'lottery' } })
      .expect(400);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['overrides.particles', 'overrides.resampling_method']));
  });

  it('refuses to replay an invalid bundle', async () => {
    const broken = await uploadBundle(withFile(files, 'map.json', '{"resolution": -1}'), 'broken.zip');
    const res = await request(t.app).post(`/api/bundles/${broken}/replays`).set(auth()).send({}).expect(409);
    expect(res.body.error.message).toMatch(/did not pass validation/);
  });
});

describe('long replays', () => {
  it('keep the server responsive, can be cancelled, and are failed on restart', async () => {
    const big = makeBundleFiles({ steps: 3000, beams: 31 });
    const bundleId = await uploadBundle(big, 'long.zip');
    const started = await request(t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { particles: 20000 } })
      .expect(202);
    // The HTTP thread answers while the worker is busy.
    let sawRunning = false;
    for (let i = 0; i < 200 && !sawRunning; i++) {
      const me = await request(t.app).get('/api/auth/me').set(auth()).expect(200);
      expect(me.body.user.role).toBe('investigator');
      const state = await request(t.app).get(`/api/replays/${started.body.id}`).set(auth());
      sawRunning = state.body.status === 'running' && state.body.progress !== null;
      if (!sawRunning) await new Promise((resolve) => setTimeout(resolve, 25));
    }
    expect(sawRunning).toBe(true);
    await request(t.app).delete(`/api/replays/${started.body.id}`).set(auth()).expect(202);
    const finished = await waitForFinish(started.body.id);
    expect(finished.status).toBe('cancelled');
    await request(t.app).delete(`/api/replays/${started.body.id}`).set(auth()).expect(409);

    // A replay left running by a stopped server is failed, never shown as done.
    const again = await request(t.app)
      .post(`/api/bundles/${bundleId}/replays`)
      .set(auth())
      .send({ overrides: { particles: 20000, seed: 3 } })
      .expect(202);
    expect(await t.app.locals.services.replays.failInterruptedReplays()).toBe(1);
    const failed = await request(t.app).get(`/api/replays/${again.body.id}`).set(auth());
    expect(failed.body.status).toBe('failed');
    expect(failed.body.error).toMatch(/restart/);
    await request(t.app).delete(`/api/replays/${again.body.id}`).set(auth());
  });
});
