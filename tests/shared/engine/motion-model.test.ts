import { describe, expect, it } from 'vitest';
import {
  decomposeOdometry,
  odometryNoiseSigmas,
  sampleOdometryMotion,
} from '../../../shared/engine/motion-model';
import { createRandomScratch } from '../../../shared/engine/random';
import { wrapAngle } from '../../../shared/engine/stats';

/** Mean and variance of a column. */
function moments(values: Float64Array): { mean: number; variance: number } {
  let mean = 0;
  for (const v of values) mean += v;
  mean /= values.length;
  let variance = 0;
  for (const v of values) variance += (v - mean) * (v - mean);
  return { mean, variance: variance / (values.length - 1) };
}

describe('odometry motion model', () => {
  it('decomposes an increment into rot1, trans, rot2 (Thrun, Burgard, Fox 2005, Table 5.6, lines 2-4)', () => {
    const increment = decomposeOdometry(1, 1, 0.2, 2, 2, 1.0);
    expect(increment.trans).toBeCloseTo(Math.SQRT2, 12);
    expect(increment.rot1).toBeCloseTo(Math.PI / 4 - 0.2, 12);
    expect(increment.rot2).toBeCloseTo(1.0 - 0.2 - (Math.PI / 4 - 0.2), 12);
  });

  it('sets rot1 to 0 for a near-zero translation so a turn in place keeps its rotation (common practice)', () => {
    const increment = decomposeOdometry(0, 0, 0, 0.0004, 0.0003, 0.5);
    expect(increment.rot1).toBe(0);
    expect(increment.rot2).toBeCloseTo(0.5, 12);
  });

  it('samples increments whose means and variances match Table 5.6 with alphas as variance coefficients', () => {
    // Thrun, Burgard, Fox, Probabilistic Robotics (2005), Table 5.6: the sampled rot1, trans, rot2
    // are the true ones minus zero-mean normals with var a1 rot1^2 + a2 trans^2, a3 trans^2 +
    // a4 (rot1^2 + rot2^2), a1 rot2^2 + a2 trans^2.
    const n = 100_000;
    // Translation noise small enough (6 sigma) that no sample reverses, so rot1 can be read back with atan2.
    const alpha: [number, number, number, number] = [0.05, 0.01, 0.02, 0.01];
    const increment = { rot1: 0.3, trans: 0.8, rot2: -0.2 };
    const x = new Float64Array(n);
    const y = new Float64Array(n);
    const theta = new Float64Array(n);
    sampleOdometryMotion(x, y, theta, 0, n, increment, alpha, 123, 5, createRandomScratch());
    const rot1 = new Float64Array(n);
    const trans = new Float64Array(n);
    const rot2 = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      rot1[i] = Math.atan2(y[i], x[i]);
      trans[i] = Math.hypot(x[i], y[i]);
      rot2[i] = wrapAngle(theta[i] - rot1[i]);
    }
    const expectedVariance = [
      alpha[0] * 0.3 ** 2 + alpha[1] * 0.8 ** 2,
      alpha[2] * 0.8 ** 2 + alpha[3] * (0.3 ** 2 + 0.2 ** 2),
      alpha[0] * 0.2 ** 2 + alpha[1] * 0.8 ** 2,
    ];
    const sigmas = odometryNoiseSigmas(increment, alpha);
    sigmas.forEach((sigma, k) => {
      expect(sigma * sigma).toBeCloseTo(expectedVariance[k], 12);
    });
    [rot1, trans, rot2].forEach((column, k) => {
      const { mean, variance } = moments(column);
      const expectedMean = [0.3, 0.8, -0.2][k];
      // Monte Carlo error: SE(mean) = sigma / sqrt(n), SE(variance) ≈ variance * sqrt(2 / n); 5 SE allowed.
      expect(Math.abs(mean - expectedMean)).toBeLessThan(5 * Math.sqrt(expectedVariance[k] / n));
      expect(Math.abs(variance - expectedVariance[k])).toBeLessThan(
        5 * expectedVariance[k] * Math.sqrt(2 / n),
      );
    });
  });

  it('gives each particle the same motion whether the set is moved in one range or two', () => {
    const n = 1000;
    const start = () => Float64Array.from({ length: n }, (_, i) => i * 0.01);
    const increment = { rot1: 0.1, trans: 0.2, rot2: 0.05 };
    const alpha: [number, number, number, number] = [0.1, 0.1, 0.1, 0.1];
    const whole = [start(), start(), start()];
    sampleOdometryMotion(whole[0], whole[1], whole[2], 0, n, increment, alpha, 7, 3, createRandomScratch());
    const split = [start(), start(), start()];
    sampleOdometryMotion(split[0], split[1], split[2], 600, n, increment, alpha, 7, 3, createRandomScratch());
    sampleOdometryMotion(split[0], split[1], split[2], 0, 600, increment, alpha, 7, 3, createRandomScratch());
    expect(split).toEqual(whole);
  });
});
