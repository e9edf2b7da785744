/**
 * Recovery by random-particle injection (augmented MCL, Thrun, Burgard, Fox, Probabilistic
 * Robotics, 2005, Table 8.3). Short- and long-term running averages w_fast and w_slow of the
 * measurement likelihood; after resampling each particle is replaced by a uniform free-space pose
 * with probability max(0, 1 - w_fast / w_slow).
 *
 * Kept in log space: scan likelihoods are products over tens of beams and underflow a float64.
 * The averaged quantity is the likelihood PER MEASUREMENT (the step's log-likelihood divided by
 * the number of beams and detections used, i.e. a geometric mean), so the ratio does not swing
 * with the number of beams in a scan. Averages start at -Infinity (w = 0), as in the book.
 */

import { type FreeSpace, placeUniformPose } from './free-space';
import { fillUniforms, type RandomScratch, RNG_PURPOSE } from './random';

/** log((1 - alpha) exp(logAverage) + alpha exp(logValue)): one running-average update in log space. */
export function updateLogAverage(logAverage: number, logValue: number, alpha: number): number {
  const a = Math.log1p(-alpha) + logAverage;
  const b = Math.log(alpha) + logValue;
  const max = Math.max(a, b);
  if (max === Number.NEGATIVE_INFINITY) return max;
  return max + Math.log(Math.exp(a - max) + Math.exp(b - max));
}

/** Table 8.3, line 13: max(0, 1 - w_fast / w_slow), from the log averages. */
export function injectionProbability(logSlow: number, logFast: number): number {
  if (logSlow === Number.NEGATIVE_INFINITY) return 0;
  return Math.max(0, 1 - Math.exp(logFast - logSlow));
}

/**
 * Replaces each particle i in [from, to) with probability `probability` by a uniform free-space
 * pose; draws are keyed (seed, injection, step, i). Sets injected[i] to 1 or 0 and returns the count.
 */
export function injectRandomParticles(
  space: FreeSpace,
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  from: number,
  to: number,
  probability: number,
  seed: number,
  step: number,
  scratch: RandomScratch,
): number {
  if (probability <= 0) return 0;
  let injected = 0;
  const u = scratch.values;
  for (let i = from; i < to; i++) {
    fillUniforms(seed, RNG_PURPOSE.injection, step, i, 0, scratch);
    if (u[0] >= probability) continue;
    fillUniforms(seed, RNG_PURPOSE.injection, step, i, 1, scratch);
    placeUniformPose(space, u[0], u[1], u[2], u[3], x, y, theta, i);
    injected++;
  }
  return injected;
}
