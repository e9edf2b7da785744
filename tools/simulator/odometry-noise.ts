import { normalizeAngle, type Pose } from './pose-math';
import type { RandomSource } from './random-source';

/** Motion between two poses as rotate–translate–rotate (rad, m, rad). */
export interface OdometryIncrement {
  rot1: number;
  trans: number;
  rot2: number;
}

/** Below this translation (m) rot1 is undefined; the whole turn goes into rot2 (common practice). */
const PURE_ROTATION_TRANS = 1e-6;

/** Splits a relative pose (expressed in the start pose's frame) into rot1, trans, rot2. */
export function decomposeIncrement(delta: Pose): OdometryIncrement {
  const trans = Math.hypot(delta.x, delta.y);
  if (trans < PURE_ROTATION_TRANS) return { rot1: 0, trans: 0, rot2: normalizeAngle(delta.theta) };
  const rot1 = Math.atan2(delta.y, delta.x);
  return { rot1, trans, rot2: normalizeAngle(delta.theta - rot1) };
}

/** The relative pose (in the start frame) of a rot1, trans, rot2 increment. */
export function incrementToPose(increment: OdometryIncrement): Pose {
  return {
    x: increment.trans * Math.cos(increment.rot1),
    y: increment.trans * Math.sin(increment.rot1),
    theta: normalizeAngle(increment.rot1 + increment.rot2),
  };
}

/**
 * Corrupts a true motion increment the way wheel odometry does, with the variances of the
 * odometry motion model (Thrun, Burgard, Fox, Probabilistic Robotics, 2005, Table 5.6):
 * var(rot1) = a1 rot1² + a2 trans², var(trans) = a3 trans² + a4 (rot1² + rot2²),
 * var(rot2) = a1 rot2² + a2 trans². `alpha` are variance coefficients, not standard deviations.
 * A pure rotation keeps trans at exactly 0, since encoders of a spin on the spot report no travel.
 */
export function corruptIncrement(
  truth: OdometryIncrement,
  alpha: readonly [number, number, number, number],
  random: RandomSource,
): OdometryIncrement {
  const [a1, a2, a3, a4] = alpha;
  const { rot1, trans, rot2 } = truth;
  const rot1Noise = random.normalWithVariance(a1 * rot1 * rot1 + a2 * trans * trans);
  const transNoise = random.normalWithVariance(a3 * trans * trans + a4 * (rot1 * rot1 + rot2 * rot2));
  const rot2Noise = random.normalWithVariance(a1 * rot2 * rot2 + a2 * trans * trans);
  return {
    rot1: rot1 + rot1Noise,
    // Encoders never report travel backwards while the robot creeps forwards.
    trans: trans > 0 ? Math.max(0, trans + transNoise) : 0,
    rot2: rot2 + rot2Noise,
  };
}
