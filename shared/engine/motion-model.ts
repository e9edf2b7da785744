/**
 * Odometry motion model, sampled per particle (Thrun, Burgard, Fox, Probabilistic Robotics, 2005,
 * Table 5.6). The alphas are coefficients of VARIANCES, as the bundle format specifies:
 *   var(rot1)  = a1 rot1^2 + a2 trans^2
 *   var(trans) = a3 trans^2 + a4 (rot1^2 + rot2^2)
 *   var(rot2)  = a1 rot2^2 + a2 trans^2
 */
import {
  philox4x32Pair,
  type RandomScratch,
  RNG_PURPOSE,
  seedKeyHigh,
  seedKeyLow,
  uniformFromWord,
} from './random';
import { wrapAngle } from './stats';
import { cosSinOfWordTurn } from './turn-trig';

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
  let rot1 = trans < MIN_TRANSLATION_FOR_ROT1 ? 0 : wrapAngle(Math.atan2(dy, dx) - theta0);
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
 * (words[offset..offset+3]): Box–Muller (Box & Muller 1958) on the pairs (w0, w1) and (w2, w3),
 * giving z0 = r_a cos, z1 = r_a sin, z2 = r_b cos (the fourth normal is not needed), with the
 * angle's cos/sin from the table in turn-trig.ts. `trig` is two numbers of scratch.
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
  trig: Float64Array,
  cosTheta: Float64Array | undefined,
  sinTheta: Float64Array | undefined,
): void {
  const radiusA = Math.sqrt(-2 * Math.log(uniformFromWord(words[offset])));
  const radiusB = Math.sqrt(-2 * Math.log(uniformFromWord(words[offset + 2])));
  cosSinOfWordTurn(words[offset + 1], trig);
  const noisyRot1 = increment.rot1 - sigmas[0] * (radiusA * trig[0]);
  const noisyTrans = increment.trans - sigmas[1] * (radiusA * trig[1]);
  cosSinOfWordTurn(words[offset + 3], trig);
  const noisyRot2 = increment.rot2 - sigmas[2] * (radiusB * trig[0]);
  const heading = theta[i] + noisyRot1;
  x[i] += noisyTrans * Math.cos(heading);
  y[i] += noisyTrans * Math.sin(heading);
  const next = heading + noisyRot2;
  const wrapped = next > Math.PI || next <= -Math.PI ? wrapAngle(next) : next;
  theta[i] = wrapped;
  if (cosTheta && sinTheta) {
    cosTheta[i] = Math.cos(wrapped);
    sinTheta[i] = Math.sin(wrapped);
  }
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
  for (let i = from; i < to; i += 2) {
    philox4x32Pair(0, i, i + 1, step, purpose, keyLow, keyHigh, words);
    moveParticle(x, y, theta, i, words, 0, increment, sigmas, values, cosTheta, sinTheta);
    if (i + 1 < to) moveParticle(x, y, theta, i + 1, words, 4, increment, sigmas, values, cosTheta, sinTheta);
  }
}
