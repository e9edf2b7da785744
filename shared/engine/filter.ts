/**
 * The replay loop: runs every step of a bundle, records per-step diagnostics, stores keyframes,
 * and can resume from a keyframe to reproduce any step's exact particle set.
 */
import type { Bundle } from '../bundle/types';
import { advanceStep, createStepWorkspace, type StepWorkspace } from './advance-step';
import { replayDigest } from './digest';
import { initializeParticles } from './initial-belief';
import {
  createParticleState,
  type Keyframe,
  type ParticleState,
  restoreState,
  snapshotState,
} from './particle-state';
import { buildReplayContext, type ReplayContext } from './replay-context';
import { createReplaySeries, type ReplaySeries, storeStepRecord } from './replay-series';
import { countMapDisagreement } from './scan-endpoints';
import type { ReplaySettings } from './settings';
import { computeTrajectoryErrors, NEES_BOUND_95, rootMeanSquare } from './trajectory-error';

/** Default spacing of keyframes, in steps. */
export const DEFAULT_KEYFRAME_INTERVAL = 100;

/** Progress report passed to `onStep` after each step. */
export interface ReplayProgress {
  step: number;
  steps: number;
}

export interface ReplayOptions {
  /** Called after every step; returning false cancels the replay. */
  onStep?: (progress: ReplayProgress) => boolean | undefined;
  /** Checked after every step; when `aborted` is true the replay is cancelled. */
  signal?: { readonly aborted: boolean };
  /** Snapshot the state after steps 0, K, 2K, ...; default 100. 0 disables keyframes. */
  keyframeInterval?: number;
  /** Reuse a context already built for the same bundle and settings. */
  context?: ReplayContext;
  /**
   * Called once before step 0 with the state and workspace, e.g. to move the particle arrays
   * into shared memory and set `workspace.particleStages` for a split across threads.
   */
  adopt?: (state: ParticleState, workspace: StepWorkspace, context: ReplayContext) => void;
  /**
   * Called after every step with the particle set as it stands (read only), e.g. for the safety
   * analysis's contact probability. It cannot change the replay or its digest.
   */
  onStepState?: (state: Readonly<ParticleState>, step: number) => void;
}

export interface ReplayMetrics {
  /** RMSE (m) of the mean position against reference_pose; null when the file is absent. */
  rmse_reference: number | null;
  rmse_onboard: number | null;
}

export interface ReplayResult {
  settings: ReplaySettings;
  steps: number;
  digest: string;
  series: ReplaySeries;
  metrics: ReplayMetrics;
  /** 95 % chi-square bound for `series.nees_onboard` (3 dof). */
  neesBound: number;
  /** Per-cell counts, map row order (see countMapDisagreement). */
  disagreementCounts: Uint32Array;
  keyframeInterval: number;
  keyframes: Keyframe[];
}

/** Thrown when `onStep` returns false or the signal is aborted. */
export class ReplayCancelledError extends Error {
  constructor(readonly step: number) {
    super(`replay cancelled after step ${step}`);
    this.name = 'ReplayCancelledError';
  }
}

/** Fresh state holding the initial belief (before step 0). */
export function createInitialState(context: ReplayContext): ParticleState {
  const { settings } = context;
  const state = createParticleState(context.capacity);
  const scratch = createStepWorkspace(context).range.random;
  initializeParticles(
    settings.initial,
    context.freeSpace,
    settings.particles,
    settings.seed,
    state.x,
    state.y,
    state.theta,
    state.logWeight,
    scratch,
  );
  state.count = settings.particles;
  return state;
}

/** Replays every step of `bundle` under `settings`. */
export function runReplay(
  bundle: Bundle,
  settings: ReplaySettings,
  options: ReplayOptions = {},
): ReplayResult {
  const context = options.context ?? buildReplayContext(bundle, settings);
  const steps = context.timeline.steps;
  const keyframeInterval = options.keyframeInterval ?? DEFAULT_KEYFRAME_INTERVAL;
  const state = createInitialState(context);
  const workspace = createStepWorkspace(context);
  options.adopt?.(state, workspace, context);
  const series = createReplaySeries(steps);
  const keyframes: Keyframe[] = [];
  for (let step = 0; step < steps; step++) {
    const record = advanceStep(context, state, workspace, step, true);
    storeStepRecord(series, step, record);
    options.onStepState?.(state, step);
    if (keyframeInterval > 0 && step % keyframeInterval === 0) keyframes.push(snapshotState(state));
    const keepGoing = options.onStep?.({ step, steps });
    if (keepGoing === false || options.signal?.aborted) throw new ReplayCancelledError(step);
  }
  computeTrajectoryErrors(series, bundle);
  return {
    settings,
    steps,
    digest: replayDigest(series),
    series,
    metrics: {
      rmse_reference: bundle.reference ? rootMeanSquare(series.error_reference) : null,
      rmse_onboard: bundle.onboard ? rootMeanSquare(series.error_onboard) : null,
    },
    neesBound: NEES_BOUND_95,
    disagreementCounts: countMapDisagreement(context, series, steps),
    keyframeInterval,
    keyframes,
  };
}

/** The keyframe to resume from for `step`: the latest one at or before it, or undefined. */
export function nearestKeyframe(keyframes: readonly Keyframe[], step: number): Keyframe | undefined {
  let best: Keyframe | undefined;
  for (const keyframe of keyframes)
    if (keyframe.step <= step && (!best || keyframe.step > best.step)) best = keyframe;
  return best;
}

/**
 * Re-simulates from `keyframe` (or from the initial belief when it is undefined) to `step` and
 * returns the state after that step: bit-identical to the full run's particles at that step.
 */
export function resumeFrom(
  context: ReplayContext,
  keyframe: Keyframe | undefined,
  step: number,
): ParticleState {
  if (keyframe && keyframe.step > step)
    throw new RangeError(`keyframe at step ${keyframe.step} is after the requested step ${step}`);
  if (step < 0 || step >= context.timeline.steps)
    throw new RangeError(`step ${step} is outside 0..${context.timeline.steps - 1}`);
  const state = keyframe ? restoreState(keyframe, context.capacity) : createInitialState(context);
  const workspace = createStepWorkspace(context);
  for (let k = state.step + 1; k <= step; k++) advanceStep(context, state, workspace, k, false);
  return state;
}
