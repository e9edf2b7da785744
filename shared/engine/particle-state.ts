/**
 * Filter state in struct-of-arrays form, and keyframes (snapshots of it). Because the random
 * numbers are keyed by (seed, step, particle), the state after step k plus k itself is everything
 * needed to continue the replay bit for bit.
 */

export interface ParticleState {
  /** Index of the last step applied; -1 before step 0. */
  step: number;
  /** Live particles: entries [0, count) of each array are valid. */
  count: number;
  /** Map frame, m */
  x: Float64Array;
  /** Map frame, m */
  y: Float64Array;
  /** Map frame, rad in (-pi, pi] */
  theta: Float64Array;
  /** Normalised natural-log weights (log-sum-exp over [0, count) is 0). */
  logWeight: Float64Array;
  /** Augmented MCL running averages, natural log of the per-measurement likelihood. */
  logSlow: number;
  logFast: number;
}

/** Serialisable snapshot of a `ParticleState` (arrays trimmed to `count`). */
export type Keyframe = ParticleState;

export function createParticleState(capacity: number): ParticleState {
  return {
    step: -1,
    count: 0,
    x: new Float64Array(capacity),
    y: new Float64Array(capacity),
    theta: new Float64Array(capacity),
    logWeight: new Float64Array(capacity),
    logSlow: Number.NEGATIVE_INFINITY,
    logFast: Number.NEGATIVE_INFINITY,
  };
}

/** Copy of the live part of `state`. */
export function snapshotState(state: ParticleState): Keyframe {
  return {
    step: state.step,
    count: state.count,
    x: state.x.slice(0, state.count),
    y: state.y.slice(0, state.count),
    theta: state.theta.slice(0, state.count),
    logWeight: state.logWeight.slice(0, state.count),
    logSlow: state.logSlow,
    logFast: state.logFast,
  };
}

/** A working state with `capacity` room, initialised from a keyframe. */
export function restoreState(keyframe: Keyframe, capacity: number): ParticleState {
  const state = createParticleState(Math.max(capacity, keyframe.count));
  state.step = keyframe.step;
  state.count = keyframe.count;
  state.x.set(keyframe.x.subarray(0, keyframe.count));
  state.y.set(keyframe.y.subarray(0, keyframe.count));
  state.theta.set(keyframe.theta.subarray(0, keyframe.count));
  state.logWeight.set(keyframe.logWeight.subarray(0, keyframe.count));
  state.logSlow = keyframe.logSlow;
  state.logFast = keyframe.logFast;
  return state;
}
