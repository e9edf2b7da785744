/**
 * Latency of `GET /api/replays/:id/steps/:k` on a 6,000-step replay with 2,000 particles:
 * the exact particle set of step k, re-simulated from the nearest keyframe. Target: under 150 ms
 * for any k once the replay's inputs are loaded. Run: `npx tsx bench/replay-step-latency.ts`.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { replayToEnd } from '../tests/support/replay-runs';
import { createTestApp } from '../tests/support/test-app';
import { largeBundleZip } from './support/large-bundle-zip';

const PARTICLES = 2000;
const SAMPLES = 60;

export async function run() {
  const zip = await largeBundleZip();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-bench-steps-'));
  const t = await createTestApp({ DATA_DIR: dataDir });
  try {
    const token = await t.tokenFor('investigator');
    const auth = { Authorization: `Bearer ${token}` };
    const cases = await request(t.app).get('/api/cases').set(auth);
    const upload = await request(t.app)
      .post(`/api/cases/${cases.body.items[0].id}/bundles`)
      .set(auth)
      .attach('bundle', zip);
    const bundleId = upload.body.bundle.id;
    const replay = await replayToEnd(t.app, token, bundleId, { overrides: { particles: PARTICLES } });
    if (replay.status !== 'done' || !replay.steps)
      throw new Error(`replay ${replay.status}: ${replay.error}`);
    const steps = replay.steps;
    const firstStart = performance.now();
    await request(t.app).get(`/api/replays/${replay.id}/steps/0`).set(auth).expect(200);
    const coldMs = performance.now() - firstStart;
    const latencies: number[] = [];
    // Fixed pseudo-random step indices (a linear congruential sequence), including the worst case
    // just before a keyframe.
    let k = 99;
    for (let i = 0; i < SAMPLES; i++) {
      const started = performance.now();
      await request(t.app).get(`/api/replays/${replay.id}/steps/${k}`).set(auth).expect(200);
      latencies.push(performance.now() - started);
      k = (k * 1103 + 4931) % steps;
    }
    latencies.sort((a, b) => a - b);
    return {
      metric: 'replay step latency',
      steps,
      particles: PARTICLES,
      replay_elapsed_ms: Math.round(replay.elapsedMs ?? 0),
      first_request_ms_including_bundle_load: Math.round(coldMs),
      median_ms: Number(latencies[Math.floor(SAMPLES / 2)].toFixed(1)),
      p95_ms: Number(latencies[Math.floor(SAMPLES * 0.95)].toFixed(1)),
      max_ms: Number(latencies[SAMPLES - 1].toFixed(1)),
      target_ms: 150,
    };
  } finally {
    await t.close();
    fs.rmSync(dataDir, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  run().then((figure) => console.log(JSON.stringify(figure)));
}
