import { describe, expect, it } from 'vitest';
import { createRandomScratch, fillNormals, RNG_PURPOSE } from '../../../shared/engine/random';
import { resampleAncestors } from '../../../shared/engine/resampling';
import { logSumExp, normalLogDensity } from '../../../shared/engine/stats';

/**
 * 1-D linear-Gaussian model x_k = x_{k-1} + u_k + w_k, z_k = x_k + v_k, w ~ N(0, q), v ~ N(0, r).
 * The Kalman filter (Kalman 1960) gives the exact posterior; a bootstrap particle filter built
 * from the engine's primitives (counter RNG normals, log-space weights, log-sum-exp, systematic
 * resampling) must converge to it.
 */
describe('particle filter vs exact Kalman filter on a 1-D linear-Gaussian model', () => {
  it('matches the Kalman posterior mean and variance at every step within Monte Carlo error', () => {
    const n = 20_000;
    const q = 0.04;
    const r = 0.09;
    const controls = [0.5, 0.5, -0.2, 0.3, 0.0, 0.8, -0.5, 0.1];
    const measurements = [0.6, 1.05, 0.7, 1.1, 1.0, 1.85, 1.3, 1.5];
    const scratch = createRandomScratch();
    let particles = new Float64Array(n);
    const logWeight = new Float64Array(n);
    const weights = new Float64Array(n);
    const ancestors = new Int32Array(n);
    // Prior N(0, 0.25).
    for (let i = 0; i < n; i++) {
      fillNormals(5, RNG_PURPOSE.test, 0, i, 0, scratch);
      particles[i] = 0.5 * scratch.values[0];
    }
    let kalmanMean = 0;
    let kalmanVariance = 0.25;
    controls.forEach((u, k) => {
      const step = k + 1;
      // Kalman (1960) predict and update.
      const predictedVariance = kalmanVariance + q;
      const gain = predictedVariance / (predictedVariance + r);
      kalmanMean = kalmanMean + u + gain * (measurements[k] - (kalmanMean + u));
      kalmanVariance = (1 - gain) * predictedVariance;
      // Particle filter: sample motion, weight in log space, normalise, resample.
      for (let i = 0; i < n; i++) {
        fillNormals(5, RNG_PURPOSE.test, step, i, 0, scratch);
        particles[i] += u + Math.sqrt(q) * scratch.values[0];
        logWeight[i] = normalLogDensity(measurements[k], particles[i], Math.sqrt(r));
      }
      const normaliser = logSumExp(logWeight, n);
      let mean = 0;
      for (let i = 0; i < n; i++) {
        weights[i] = Math.exp(logWeight[i] - normaliser);
        mean += weights[i] * particles[i];
      }
      let variance = 0;
      for (let i = 0; i < n; i++) variance += weights[i] * (particles[i] - mean) ** 2;
      // Monte Carlo error of a weighted mean with ESS ≥ n/3: 5 sigma/sqrt(n/3); variance within 5 %.
      expect(Math.abs(mean - kalmanMean)).toBeLessThan(5 * Math.sqrt((3 * kalmanVariance) / n));
      expect(Math.abs(variance - kalmanVariance) / kalmanVariance).toBeLessThan(0.05);
      resampleAncestors(
        'systematic',
        weights,
        n,
        n,
        ancestors,
        5,
        step,
        new Float64Array(n),
        new Float64Array(n),
        scratch,
      );
      particles = Float64Array.from(ancestors, (a) => particles[a]);
    });
  });
});
