import { describe, expect, it } from 'vitest';
import { createStepWorkspace } from '../../../shared/engine/advance-step';
import {
  createInitialState,
  nearestKeyframe,
  ReplayCancelledError,
  resumeFrom,
  runReplay,
} from '../../../shared/engine/filter';
import {
  computeHeadingTrig,
  createRangeScratch,
  moveParticleRange,
  weighParticleRange,
} from '../../../shared/engine/filter-step';
import { createRandomScratch } from '../../../shared/engine/random';
import { buildReplayContext } from '../../../shared/engine/replay-context';
import { scanEndpointsAt } from '../../../shared/engine/scan-endpoints';
import { resolveReplaySettings, type TReplayOverrides } from '../../../shared/engine/settings';
import { makeSyntheticBundle } from '../../support/engine-fixtures';

const bundle = makeSyntheticBundle({ seconds: 40, particles: 300 });

function settingsWith(overrides: TReplayOverrides = {}) {
  const resolved = resolveReplaySettings(bundle.manifest, overrides);
  if (!resolved.ok) throw new Error(JSON.stringify(resolved.issues));
  return resolved.settings;
}

describe('replay determinism', () => {
  const first = runReplay(bundle, settingsWith(), { keyframeInterval: 50 });

  it('gives the same digest on a second run and a different digest with another seed', () => {
    expect(runReplay(bundle, settingsWith()).digest).toBe(first.digest);
    expect(runReplay(bundle, settingsWith({ seed: 8 })).digest).not.toBe(first.digest);
    expect(first.digest).toMatch(/^[0-9a-f]{64}$/);
  });

  it('resumes from a keyframe to the bit-identical particle set of the full run', () => {
    const context = buildReplayContext(bundle, settingsWith());
    const target = 237;
    // Reference: the full run's state at `target`, as a keyframe taken every step would store it.
    const everyStep = runReplay(bundle, settingsWith(), { keyframeInterval: 1 });
    const expected = everyStep.keyframes[target];
    const resumed = resumeFrom(context, nearestKeyframe(first.keyframes, target), target);
    expect(nearestKeyframe(first.keyframes, target)?.step).toBe(200);
    expect(resumed.count).toBe(expected.count);
    expect(resumed.x.slice(0, resumed.count)).toEqual(expected.x);
    expect(resumed.y.slice(0, resumed.count)).toEqual(expected.y);
    expect(resumed.theta.slice(0, resumed.count)).toEqual(expected.theta);
    expect(resumed.logWeight.slice(0, resumed.count)).toEqual(expected.logWeight);
    expect(resumeFrom(context, undefined, target).x.slice(0, expected.count)).toEqual(expected.x);
  });

  it('tracks the reference trajectory of the synthetic warehouse log', () => {
    // Simulated laser noise 0.02 m and sigma_hit 0.1 m: a working filter stays within a few cm.
    expect(first.metrics.rmse_reference).not.toBeNull();
    expect(first.metrics.rmse_reference!).toBeLessThan(0.1);
    expect(first.series.ess.every((ess) => ess >= 1 && ess <= 300 + 1e-9)).toBe(true);
    expect(first.series.clusters.every((count) => count >= 1)).toBe(true);
  });

  it('gives the same motion and weights when a step is split into particle ranges', () => {
    const context = buildReplayContext(bundle, settingsWith());
    const whole = createInitialState(context);
    const split = createInitialState(context);
    const workspace = createStepWorkspace(context);
    const scratch = createRangeScratch(context, createRandomScratch());
    moveParticleRange(context, whole, 11, 0, whole.count, scratch);
    moveParticleRange(context, split, 11, 150, split.count, scratch);
    moveParticleRange(context, split, 11, 0, 150, scratch);
    expect(split.x).toEqual(whole.x);
    const weigh = (state: typeof whole, ranges: [number, number][]) => {
      const out = new Float64Array(state.count);
      computeHeadingTrig(state.theta, 0, state.count, workspace.cosTheta, workspace.sinTheta);
      for (const [from, to] of ranges)
        weighParticleRange(
          context,
          state,
          11,
          from,
          to,
          workspace.cosTheta,
          workspace.sinTheta,
          out,
          scratch,
        );
      return out;
    };
    expect(
      weigh(split, [
        [100, 300],
        [0, 100],
      ]),
    ).toEqual(weigh(whole, [[0, 300]]));
  });

  it('stops when onStep returns false', () => {
    expect(() => runReplay(bundle, settingsWith(), { onStep: ({ step }) => step < 10 })).toThrow(
      ReplayCancelledError,
    );
  });

  it('places the mean-pose scan endpoints on the map walls for a healthy log', () => {
    const context = buildReplayContext(bundle, settingsWith());
    const endpoints = scanEndpointsAt(context, first.series, 100);
    expect(endpoints.length).toBeGreaterThan(20);
    const field = context.field!;
    let near = 0;
    for (let e = 0; e < endpoints.length; e += 2) {
      const column = Math.floor((endpoints[e] - field.originX) / field.resolution);
      const row = Math.floor((endpoints[e + 1] - field.originY) / field.resolution);
      if (field.distance[row * field.width + column] < 0.15) near++;
    }
    expect(near / (endpoints.length / 2)).toBeGreaterThan(0.9);
    // Nothing in the simulated hall disagrees with the map much.
    const total = first.disagreementCounts.reduce((sum, count) => sum + count, 0);
    expect(total).toBeLessThan(0.01 * first.steps * 60);
  });
});

describe('variants', () => {
  it.each(['multinomial', 'stratified', 'residual'] as const)('tracks with %s resampling too', (method) => {
    const result = runReplay(bundle, settingsWith({ resampling_method: method }));
    expect(result.metrics.rmse_reference!).toBeLessThan(0.1);
    expect(result.series.resampled.some((code) => code > 0)).toBe(true);
  });

  it('adapts the particle count with KLD-sampling and recovers with injection enabled', () => {
    const result = runReplay(bundle, settingsWith({ kld: true, recovery: true }));
    const counts = new Set(result.series.particles);
    expect(counts.size).toBeGreaterThan(1);
    expect(Math.max(...result.series.particles)).toBeLessThanOrEqual(300);
    expect(result.metrics.rmse_reference!).toBeLessThan(0.15);
  });
});
