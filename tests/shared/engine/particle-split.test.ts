/**
 * A replay whose per-particle stages are split across three threads (this one and two worker
 * threads sharing the particle arrays) has the digest of the single-threaded replay, and the
 * helpers really took part. A helper that never joins changes nothing either.
 */
import { once } from 'node:events';
import { Worker } from 'node:worker_threads';
import { describe, expect, it } from 'vitest';
import { replayBundle } from '../../../shared/engine';
import { adoptSplit, createSplitBuffers, finishSplit } from '../../../shared/engine/particle-split';
import { buildReplayContext } from '../../../shared/engine/replay-context';
import { resolveReplaySettings } from '../../../shared/engine/settings';
import { makeSyntheticBundle, type SyntheticBundleOptions } from '../../support/engine-fixtures';

const FIXTURE = new URL('../../support/split-helper-fixture.ts', import.meta.url).href;

function startHelper(workerData: unknown): Worker {
  const entry = `import('tsx/esm/api').then((tsx) => { tsx.register(); return import(${JSON.stringify(FIXTURE)}); });`;
  return new Worker(entry, { eval: true, workerData });
}

describe('particle split across threads', () => {
  const bundleOptions: SyntheticBundleOptions = { seconds: 20, particles: 1500, landmarkRich: true };
  const bundle = makeSyntheticBundle(bundleOptions);
  const resolved = resolveReplaySettings(bundle.manifest, { resampling_method: 'residual' });
  if (!resolved.ok) throw new Error('settings');
  const settings = resolved.settings;
  const single = replayBundle(bundle, {}, { settings, keyframeInterval: 0 });

  it('gives the single-thread digest with three threads, the helpers doing part of the work', async () => {
    const context = buildReplayContext(bundle, settings);
    const buffers = createSplitBuffers(context.capacity);
    const helpers = [0, 1].map(() => startHelper({ bundleOptions, settings, buffers }));
    const reports = helpers.map((helper) => once(helper, 'message'));
    // Give the helpers time to load before the replay starts, so they surely take chunks.
    await new Promise((resolve) => setTimeout(resolve, 4000));
    try {
      const split = replayBundle(
        bundle,
        {},
        { settings, context, keyframeInterval: 0, adopt: adoptSplit(context, buffers) },
      );
      expect(split.digest).toBe(single.digest);
    } finally {
      finishSplit(buffers);
    }
    const chunks = (await Promise.all(reports)).map(([report]) => (report as { chunks: number }).chunks);
    expect(chunks.reduce((a, b) => a + b, 0)).toBeGreaterThan(0);
    await Promise.all(helpers.map((helper) => helper.terminate()));
  }, 120_000);

  it('runs on alone when no helper joins', () => {
    const context = buildReplayContext(bundle, settings);
    const buffers = createSplitBuffers(context.capacity);
    const alone = replayBundle(
      bundle,
      {},
      { settings, context, keyframeInterval: 0, adopt: adoptSplit(context, buffers) },
    );
    finishSplit(buffers);
    expect(alone.digest).toBe(single.digest);
  });
});
