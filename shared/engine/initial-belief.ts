/**
 * Initial particle set from the manifest's `filter.initial`: a Gaussian around a pose
 * (independent x, y, theta with sigma_xy, sigma_xy, sigma_theta) or uniform over free cells.
 * Draws are keyed (seed, initialBelief, step 0, particle).
 */

import type { InitialBelief } from '../bundle/types';
import { type FreeSpace, placeUniformPose } from './free-space';
import { log } from './numerics';
import { fillNormals, fillUniforms, type RandomScratch, RNG_PURPOSE } from './random';
import { wrapAngle } from './stats';

/** Fills particles [0, n) (map frame, m and rad) and sets their log-weights to -ln n. */
export function initializeParticles(
  initial: InitialBelief,
  space: FreeSpace,
  n: number,
  seed: number,
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  logWeight: Float64Array,
  scratch: RandomScratch,
): void {
  const values = scratch.values;
  const uniformLogWeight = -log(n);
  for (let i = 0; i < n; i++) {
    if (initial.mode === 'pose') {
      fillNormals(seed, RNG_PURPOSE.initialBelief, 0, i, 0, scratch);
      x[i] = initial.x + initial.sigma_xy * values[0];
      y[i] = initial.y + initial.sigma_xy * values[1];
      theta[i] = wrapAngle(initial.theta + initial.sigma_theta * values[2]);
    } else {
      fillUniforms(seed, RNG_PURPOSE.initialBelief, 0, i, 1, scratch);
      placeUniformPose(space, values[0], values[1], values[2], values[3], x, y, theta, i);
    }
    logWeight[i] = uniformLogWeight;
  }
}
