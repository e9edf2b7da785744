import { execFile } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { zipFolder } from '../../api/src/bundles/zip-folder';
import { type CaseTestbed, createCaseTestbed } from '../support/case-testbed';
import { replayToEnd } from '../support/replay-runs';

const run = promisify(execFile);
const SAMPLE = path.resolve('sample-logs/wheel-slip');

let bed: CaseTestbed;
beforeAll(async () => {
  bed = await createCaseTestbed();
});
afterAll(() => bed.close());

async function cliReplay(jsonFile: string, extra: string[] = []) {
  await run('npx', ['tsx', 'api/src/cli/main.ts', 'replay', SAMPLE, '--json', jsonFile, ...extra], {
    timeout: 120_000,
  });
  return JSON.parse(fs.readFileSync(jsonFile, 'utf8'));
}

describe('one engine, one digest', () => {
  it('gives the same digest and flags from two CLI runs and from the API', async () => {
    const first = await cliReplay(path.join(bed.dir, 'a.json'));
    const second = await cliReplay(path.join(bed.dir, 'b.json'));
    expect(first.digest).toMatch(/^[0-9a-f]{64}$/);
    expect(second.digest).toBe(first.digest);

    const zip = await zipFolder(SAMPLE, path.join(bed.dir, 'wheel-slip.zip'));
    const auth = { Authorization: `Bearer ${bed.token}` };
    const upload = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/bundles`)
      .set(auth)
      .attach('bundle', zip);
    const replay = await replayToEnd(bed.t.app, bed.token, upload.body.bundle.id);
    expect(replay.status).toBe('done');
    expect(replay.digest).toBe(first.digest);
    expect(replay.flags.map((f) => f.kind)).toEqual(first.flags.map((f: { kind: string }) => f.kind));
    // The separation and stopping analysis: the same numbers from the CLI and from the API.
    const single = await request(bed.t.app).get(`/api/replays/${replay.id}`).set(auth).expect(200);
    const safety = single.body.safety;
    expect(safety).toEqual(first.safety);
    expect(Object.keys(safety.min_clearance).sort()).toEqual(['basis', 't', 'to', 'value']);
    expect(safety.series.stopping_margin).toHaveLength(replay.steps as number);
    expect(safety.caution).toMatch(/licensed safety professionals/);
    // The slip's protective stop (sample-logs/wheel-slip/events.csv, 23.0 s) ended short of contact.
    const stop = safety.events.find((e: { kind: string }) => e.kind === 'protective_stop');
    expect(stop).toMatchObject({ t: 23, suggested_class: 'near_miss' });
    for (const key of ['speed', 'clearance', 'stopping_distance', 'margin', 'margin_negative_since'])
      expect(stop).toHaveProperty(key);
    // Probable causes: the same list from the CLI and the API, the slip (catalog.json) on top.
    expect(single.body.causes).toEqual(first.causes);
    expect(first.causes[0]).toMatchObject({ kind: 'odometry_fault' });
    expect(first.causes[0].counterfactuals[0].digest).toMatch(/^[0-9a-f]{64}$/);
    // The wheel slip (18 s to 22 s, sample-logs/catalog.json) is flagged by the API replay too.
    expect(
      replay.flags.some((f) => f.kind === 'odometry_disagrees_with_scans' && f.start <= 21 && f.end >= 18),
    ).toBe(true);
  });

  it('changes the digest with the seed and rejects a bad option with exit code 2', async () => {
    const seeded = await cliReplay(path.join(bed.dir, 'c.json'), ['--seed', '99', '--particles', '300']);
    const first = JSON.parse(fs.readFileSync(path.join(bed.dir, 'a.json'), 'utf8'));
    expect(seeded.digest).not.toBe(first.digest);
    expect(seeded.settings.particles).toBe(300);
    const bad = await run('npx', [
      'tsx',
      'api/src/cli/main.ts',
      'replay',
      SAMPLE,
      '--resampling',
      'lottery',
    ]).catch((error: { code: number; stderr: string }) => error);
    expect((bad as { code: number }).code).toBe(2);
    expect((bad as { stderr: string }).stderr).toMatch(/resampling/);
  });
});
