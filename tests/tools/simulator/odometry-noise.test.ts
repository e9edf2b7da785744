import { describe, expect, it } from 'vitest';
import {
  corruptIncrement,
  decomposeIncrement,
  incrementToPose,
  type OdometryIncrement,
} from '../../../tools/simulator/odometry-noise';
import { RandomSource } from '../../../tools/simulator/random-source';

/** Sample mean and variance of a series. */
function moments(values: Float64Array): { mean: number; variance: number } {
  let sum = 0;
  for (const v of values) sum += v;
  const mean = sum / values.length;
  let squares = 0;
  for (const v of values) squares += (v - mean) ** 2;
  return { mean, variance: squares / (values.length - 1) };
}

describe('corruptIncrement', () => {
  // Thrun, Burgard, Fox, Probabilistic Robotics (2005), Table 5.6 (sample_motion_model_odometry):
  // var(rot1) = a1 rot1² + a2 trans², var(trans) = a3 trans² + a4 (rot1² + rot2²),
  // var(rot2) = a1 rot2² + a2 trans², with alpha as variance coefficients.
  it('has the variances of the odometry motion model within Monte Carlo error', () => {
    const alpha: [number, number, number, number] = [0.05, 0.01, 0.04, 0.02];
    const truth: OdometryIncrement = { rot1: 0.3, trans: 0.5, rot2: -0.2 };
    const samples = 100_000;
    const random = new RandomSource(20260514);
    const rot1 = new Float64Array(samples);
    const trans = new Float64Array(samples);
    const rot2 = new Float64Array(samples);
    for (let i = 0; i < samples; i++) {
      const noisy = corruptIncrement(truth, alpha, random);
      rot1[i] = noisy.rot1;
      trans[i] = noisy.trans;
      rot2[i] = noisy.rot2;
    }
    const expected = {
      rot1: alpha[0] * 0.3 ** 2 + alpha[1] * 0.5 ** 2,
      trans: alpha[2] * 0.5 ** 2 + alpha[3] * (0.3 ** 2 + 0.2 ** 2),
      rot2: alpha[0] * 0.2 ** 2 + alpha[1] * 0.5 ** 2,
    };
    const series = { rot1, trans, rot2 };
    for (const key of ['rot1', 'trans', 'rot2'] as const) {
      const { mean, variance } = moments(series[key]);
      // Standard error of a normal sample variance is sigma² sqrt(2 / (n - 1)) (common practice); allow 5.
      const varianceTolerance = 5 * expected[key] * Math.sqrt(2 / (samples - 1));
      expect(Math.abs(variance - expected[key])).toBeLessThan(varianceTolerance);
      // Standard error of the mean is sigma / sqrt(n); the noise is zero-mean.
      expect(Math.abs(mean - truth[key])).toBeLessThan(5 * Math.sqrt(expected[key] / samples));
    }
  });

  it('leaves a pure rotation with zero translation', () => {
    const random = new RandomSource(3);
    const noisy = corruptIncrement({ rot1: 0, trans: 0, rot2: 0.4 }, [0.05, 0.01, 0.05, 0.01], random);
    expect(noisy.trans).toBe(0);
  });
});

describe('decomposeIncrement', () => {
  it('round-trips through incrementToPose', () => {
    const delta = { x: 0.31, y: -0.12, theta: 0.27 };
    const back = incrementToPose(decomposeIncrement(delta));
    expect(back.x).toBeCloseTo(delta.x, 12);
    expect(back.y).toBeCloseTo(delta.y, 12);
    expect(back.theta).toBeCloseTo(delta.theta, 12);
  });
});
