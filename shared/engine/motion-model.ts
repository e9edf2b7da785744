/**
 * Odometry motion model, sampled per particle (Thrun, Burgard, Fox, Probabilistic Robotics, 2005,
 * Table 5.6). The alphas are coefficients of VARIANCES, as the bundle format specifies:
 *   var(rot1)  = a1 rot1^2 + a2 trans^2
 *   var(trans) = a3 trans^2 + a4 (rot1^2 + rot2^2)
 *   var(rot2)  = a1 rot2^2 + a2 trans^2
 */

import { atan2, sinCos } from './numerics';
import { philox4x32Pair, type RandomScratch, RNG_PURPOSE, seedKeyHigh, seedKeyLow } from './random';
import { wrapAngle } from './stats';
import { zigguratNormal } from './ziggurat';

/** Below this translation (m) the heading of travel is meaningless, so rot1 is set to 0 (common practice). */
export const MIN_TRANSLATION_FOR_ROT1 = 1e-3;

/** Decomposition of one odometry increment (Table 5.6, lines 2-4). Radians and metres. */
export interface OdometryIncrement {
  rot1: number;
  trans: number;
  rot2: number;
}

/**
 * Splits the odometry change from pose (x0, y0, theta0) to (x1, y1, theta1), both in the robot's
 * odometry frame, into rot1, trans, rot2. Reverse motion (travel direction more than 90 degrees from
 * the heading) is expressed as a negative translation so rot1 stays small (common practice).
 */
export function decomposeOdometry(
  x0: number,
  y0: number,
  theta0: number,
  x1: number,
  y1: number,
  theta1: number,
): OdometryIncrement {
  const dx = x1 - x0;
  const dy = y1 - y0;
  let trans = Math.sqrt(dx * dx + dy * dy);
  let rot1 = trans < MIN_TRANSLATION_FOR_ROT1 ? 0 : wrapAngle(atan2(dy, dx) - theta0);
  if (Math.abs(rot1) > Math.PI / 2) {
    rot1 = wrapAngle(rot1 - Math.PI);
    trans = -trans;
  }
  const rot2 = wrapAngle(theta1 - theta0 - rot1);
  return { rot1, trans, rot2 };
}

/** Standard deviations of the three increments under `alpha` (variance coefficients). */
export function odometryNoiseSigmas(
  increment: OdometryIncrement,
  alpha: readonly [number, number, number, number],
): [number, number, number] {
  const { rot1, trans, rot2 } = increment;
  const [a1, a2, a3, a4] = alpha;
  return [
    Math.sqrt(a1 * rot1 * rot1 + a2 * trans * trans),
    Math.sqrt(a3 * trans * trans + a4 * (rot1 * rot1 + rot2 * rot2)),
    Math.sqrt(a1 * rot2 * rot2 + a2 * trans * trans),
  ];
}

/**
 * Moves particle i by the increment perturbed with three standard normals from one Philox block
 * (words[offset..offset+3]): ziggurat deviates (ziggurat.ts) with values from words 0, 1, 2 and
 * layers from the low three bytes of word 3. Writes the new heading's sin and cos when asked.
 */
function moveParticle(
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  i: number,
  words: Uint32Array,
  offset: number,
  increment: OdometryIncrement,
  sigmas: readonly [number, number, number],
  noise: MotionNoiseCounters,
  trig: Float64Array,
  cosTheta: Float64Array | undefined,
  sinTheta: Float64Array | undefined,
): void {
  const w0 = words[offset];
  const w1 = words[offset + 1];
  const w2 = words[offset + 2];
  const layers = words[offset + 3];
  const { step, purpose, keyLow, keyHigh, words: spare } = noise;
  const n0 = zigguratNormal(w0, layers & 0xff, 0, i, step, purpose, keyLow, keyHigh, spare);
  const n1 = zigguratNormal(w1, (layers >>> 8) & 0xff, 1, i, step, purpose, keyLow, keyHigh, spare);
  const n2 = zigguratNormal(w2, (layers >>> 16) & 0xff, 2, i, step, purpose, keyLow, keyHigh, spare);
  const noisyRot1 = increment.rot1 - sigmas[0] * n0;
  const noisyTrans = increment.trans - sigmas[1] * n1;
  const noisyRot2 = increment.rot2 - sigmas[2] * n2;
  const heading = theta[i] + noisyRot1;
  sinCos(heading, trig);
  x[i] += noisyTrans * trig[1];
  y[i] += noisyTrans * trig[0];
  const next = heading + noisyRot2;
  const wrapped = next > Math.PI || next <= -Math.PI ? wrapAngle(next) : next;
  theta[i] = wrapped;
  if (cosTheta && sinTheta) {
    sinCos(wrapped, trig);
    cosTheta[i] = trig[1];
    sinTheta[i] = trig[0];
  }
}

/** Counters and scratch the ziggurat's slow path needs to draw further blocks. */
interface MotionNoiseCounters {
  step: number;
  purpose: number;
  keyLow: number;
  keyHigh: number;
  /** Separate from the motion loop's words, which the slow path must not overwrite. */
  words: Uint32Array;
}

/**
 * Moves particles [from, to) in place by one sampled odometry increment (map frame, m and rad).
 * Noise for particle i at `step` comes from the counter RNG block (0, i, step, motion) under the
 * seed's key, so the result does not depend on how particle ranges are split between threads
 * (particles are computed two at a time only to overlap the two Philox chains). When given,
 * `cosTheta`/`sinTheta` receive cos and sin of each new heading, saving the weighting a pass.
 */
export function sampleOdometryMotion(
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  from: number,
  to: number,
  increment: OdometryIncrement,
  alpha: readonly [number, number, number, number],
  seed: number,
  step: number,
  scratch: RandomScratch,
  cosTheta?: Float64Array,
  sinTheta?: Float64Array,
): void {
  const sigmas = odometryNoiseSigmas(increment, alpha);
  const { words, values } = scratch;
  const keyLow = seedKeyLow(seed);
  const keyHigh = seedKeyHigh(seed);
  const purpose = RNG_PURPOSE.motion;
  const noise: MotionNoiseCounters = { step, purpose, keyLow, keyHigh, words: scratch.fallbackWords };
  for (let i = from; i < to; i += 2) {
    philox4x32Pair(0, i, i + 1, step, purpose, keyLow, keyHigh, words);
    moveParticle(x, y, theta, i, words, 0, increment, sigmas, noise, values, cosTheta, sinTheta);
    if (i + 1 < to)
      moveParticle(x, y, theta, i + 1, words, 4, increment, sigmas, noise, values, cosTheta, sinTheta);
  }
}
