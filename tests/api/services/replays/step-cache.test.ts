import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { writeReplayFiles } from '../../../../api/src/replays/replay-files';
import { nodeEngineStamp } from '../../../../api/src/replays/runtime';
import { createStepCache } from '../../../../api/src/services/replays/step-cache';
import { validateBundleFiles } from '../../../../shared/bundle/validate-bundle-files';
import { runReplay } from '../../../../shared/engine/filter';
import { resolveReplaySettings } from '../../../../shared/engine/settings';
import { makeBundleFiles } from '../../../support/bundle-fixtures';

// A step is answered from cached inputs. A load that failed once (its files were being rebuilt, or
// the bundle could not be read for a moment) must not be remembered, or every later request for
// that replay fails until the server restarts.

const parsed = validateBundleFiles(makeBundleFiles({ steps: 30, beams: 5 }));
if (!parsed.ok) throw new Error('fixture should be valid');
const bundle = parsed.bundle;
const resolved = resolveReplaySettings(bundle.manifest);
if (!resolved.ok) throw new Error('fixture settings should resolve');
const result = runReplay(bundle, resolved.settings);
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'driftcase-step-cache-'));
writeReplayFiles(dir, result, { elapsedMs: 1, flags: [], divergedAt: null, engine: nodeEngineStamp() });
afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe('the step cache', () => {
  it('loads again after a failed load instead of repeating the failure', async () => {
    let calls = 0;
    const cache = createStepCache(async () => {
      calls += 1;
      if (calls === 1) throw new Error('bundle briefly unreadable');
      return bundle;
    });
    await expect(cache.stepAt('r1', 'b1', dir, 5)).rejects.toThrow(/briefly unreadable/);
    const step = await cache.stepAt('r1', 'b1', dir, 5);
    expect(step.step).toBe(5);
    // Reference: the replay's own series, written by the engine run above, not by the cache.
    expect(step.mean.x).toBe(result.series.x[5]);
    expect(calls).toBe(2);
  });

  it('keeps a successful load: a second step does not load the bundle again', async () => {
    let calls = 0;
    const cache = createStepCache(async () => {
      calls += 1;
      return bundle;
    });
    await cache.stepAt('r2', 'b1', dir, 3);
    await cache.stepAt('r2', 'b1', dir, 7);
    expect(calls).toBe(1);
  });
});
