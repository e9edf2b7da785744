import { describe, expect, it } from 'vitest';
import { advanceStep, createStepWorkspace } from '../../../shared/engine/advance-step';
import { replayDigest } from '../../../shared/engine/digest';
import { createInitialState, runReplay } from '../../../shared/engine/filter';
import { createRangeScratch, runParticleStages } from '../../../shared/engine/filter-step';
import { createRandomScratch } from '../../../shared/engine/random';
import { buildReplayContext } from '../../../shared/engine/replay-context';
import { createReplaySeries, storeStepRecord } from '../../../shared/engine/replay-series';
import { resolveReplaySettings } from '../../../shared/engine/settings';
import { makeSyntheticBundle } from '../../support/engine-fixtures';

describe('per-particle stages split into ranges', () => {
  it('gives the digest of the single-range replay for uneven splits with separate scratch per range', () => {
    // Counter-based random numbers (Salmon et al. 2011) make each particle's draws depend only on
    // (seed, step, particle), so any split of the particles, as across threads, is bit-identical.
    const bundle = makeSyntheticBundle({ seconds: 15, particles: 301 });
    const resolved = resolveReplaySettings(bundle.manifest, {});
    if (!resolved.ok) throw new Error(JSON.stringify(resolved.issues));
    const context = buildReplayContext(bundle, resolved.settings);
    const whole = runReplay(bundle, resolved.settings, { context });

    const state = createInitialState(context);
    const workspace = createStepWorkspace(context);
    // One scratch per range, as each thread would have its own.
    const scratches = [0, 1, 2].map(() => createRangeScratch(context, createRandomScratch()));
    let calls = 0;
    workspace.particleStages = (step, count) => {
      calls++;
      const cuts = [0, Math.min(count, 37), Math.min(count, 190), count];
      const buffers = {
        cosTheta: workspace.cosTheta,
        sinTheta: workspace.sinTheta,
        logLikelihood: workspace.stepLogLikelihood,
      };
      // Later ranges first: the order of evaluation must not matter either.
      let measurements = 0;
      for (const part of [2, 1, 0]) {
        const range = [cuts[part], cuts[part + 1]] as const;
        measurements = runParticleStages(context, state, step, range, buffers, scratches[part]);
      }
      return measurements;
    };
    const series = createReplaySeries(context.timeline.steps);
    for (let step = 0; step < context.timeline.steps; step++)
      storeStepRecord(series, step, advanceStep(context, state, workspace, step, true));

    expect(calls).toBe(context.timeline.steps);
    expect(replayDigest(series)).toBe(whole.digest);
  });
});
