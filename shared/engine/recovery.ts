/**
 * Recovery by random-particle injection (augmented MCL, Thrun, Burgard, Fox, Probabilistic
 * Robotics, 2005, Table 8.3). Short- and long-term running averages w_fast and w_slow of the
 * measurement likelihood; after resampling each particle is replaced with probability
 * max(0, 1 - w_fast / w_slow) by a pose drawn from the step's landmark detections (sensor
 * resetting; see measurement-sampling.ts and recovery-proposal.ts), or, for a bundle without
 * landmarks or detections, by a uniform free-space pose as in the book.
 *
 * Kept in log space: scan likelihoods are products over tens of beams and underflow a float64.
 * The averaged quantity is the likelihood PER MEASUREMENT (the step's log-likelihood divided by
 * the number of beams and detections used, i.e. a geometric mean), so the ratio does not swing
 * with the number of beams in a scan.
 *
 * Averages start at the first measured value, not at w = 0
 * as in the book: from 0, w_slow (alpha 0.001) needs thousands of steps to reach the level of the
 * likelihood, so on our 70-80 s samples it stayed below w_fast, a belief stuck at a poor look-alike
 * (w_fast well under the healthy level) got no injection at all, and the first push did only once
 * the short average fell under the still-low long one.
 */

import type { DetectionTable, OccupancyGrid } from '../bundle/types';
import { type FreeSpace, placeUniformPose } from './free-space';
import type { LandmarkModel } from './landmark-model';
import { drawProposalPose, isFreePosition } from './measurement-sampling';
import { exp, log, log1p } from './numerics';
import type { ParticleState } from './particle-state';
import type { WeightedPoseSummary } from './pose-statistics';
import { fillNormals, fillUniforms, type RandomScratch, RNG_PURPOSE } from './random';
import { type BeliefPrior, buildMeasurementProposal, type MeasurementProposal } from './recovery-proposal';
import type { ReplayContext } from './replay-context';

/**
 * How far (m, one sigma) an unnoticed push or slip may carry the robot between measurements: the
 * spread added to the belief's own when weighting measurement-model proposals. 0.5 m keeps the
 * 0.7 m push of pushed-aside within 1.4 sigma while a look-alike one aisle over (3.8 m) is 7.6
 * sigma away; 1 m let moved-rack's stale map pull the belief to poses 2-4 m off (RMSE 1.2 m).
 */
export const BELIEF_SPREAD = 0.5;

/**
 * How far (rad, one sigma) an unnoticed slip may turn the heading: enough for wheel-slip's turn,
 * while the mirror-image pose a symmetric landmark pair also explains (heading off by pi) drops out.
 */
export const BELIEF_HEADING_SPREAD = 0.5;

/** Draws from the measurement model that land off free space are retried this many times. */
export const PROPOSAL_ATTEMPTS = 8;

/** log((1 - alpha) exp(logAverage) + alpha exp(logValue)); the first value seeds the average. */
export function updateLogAverage(logAverage: number, logValue: number, alpha: number): number {
  if (logAverage === Number.NEGATIVE_INFINITY) return logValue;
  const a = log1p(-alpha) + logAverage;
  const b = log(alpha) + logValue;
  const max = Math.max(a, b);
  if (max === Number.NEGATIVE_INFINITY) return max;
  return max + log(exp(a - max) + exp(b - max));
}

/** Table 8.3, line 13: max(0, 1 - w_fast / w_slow), from the log averages. */
export function injectionProbability(logSlow: number, logFast: number): number {
  if (logSlow === Number.NEGATIVE_INFINITY) return 0;
  return Math.max(0, 1 - exp(logFast - logSlow));
}

/** A step's detections as a proposal for injected poses. */
export interface InjectionProposal {
  model: LandmarkModel;
  detections: DetectionTable;
  table: MeasurementProposal;
  /** Injected poses must stand on free cells of this grid (inside the map without one). */
  grid?: OccupancyGrid;
}

/**
 * Replaces each particle i in [from, to) with probability `probability`: by a pose drawn from
 * `proposal` when given (a particle whose PROPOSAL_ATTEMPTS draws all land off free space is kept),
 * else by a uniform free-space pose. Draws are keyed (seed, injection, step, i, draw): draw 0
 * decides, draw 1 is the uniform pose, draws 2 + 2a (uniforms) and 3 + 2a (normals) are attempt a.
 * Returns the number of particles replaced.
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
  proposal?: InjectionProposal,
): number {
  if (probability <= 0) return 0;
  let injected = 0;
  const u = scratch.values;
  const pose = new Float64Array(3);
  const normals = new Float64Array(4);
  for (let i = from; i < to; i++) {
    fillUniforms(seed, RNG_PURPOSE.injection, step, i, 0, scratch);
    if (u[0] >= probability) continue;
    if (proposal) {
      if (!drawFreeProposalPose(proposal, space, seed, step, i, scratch, normals, pose)) continue;
      x[i] = pose[0];
      y[i] = pose[1];
      theta[i] = pose[2];
    } else {
      fillUniforms(seed, RNG_PURPOSE.injection, step, i, 1, scratch);
      placeUniformPose(space, u[0], u[1], u[2], u[3], x, y, theta, i);
    }
    injected++;
  }
  return injected;
}

function drawFreeProposalPose(
  proposal: InjectionProposal,
  space: FreeSpace,
  seed: number,
  step: number,
  particle: number,
  scratch: RandomScratch,
  normals: Float64Array,
  pose: Float64Array,
): boolean {
  const { model, detections, table, grid } = proposal;
  for (let attempt = 0; attempt < PROPOSAL_ATTEMPTS; attempt++) {
    fillNormals(seed, RNG_PURPOSE.injection, step, particle, 3 + 2 * attempt, scratch);
    normals.set(scratch.values);
    fillUniforms(seed, RNG_PURPOSE.injection, step, particle, 2 + 2 * attempt, scratch);
    drawProposalPose(table, model, detections, scratch.values[0], scratch.values[1], normals, pose);
    if (isFreePosition(grid, space, pose[0], pose[1])) return true;
  }
  return false;
}

/**
 * The proposal for step `step`: its detections, weighted by the belief `pose` (weighted mean and
 * covariance, map frame) smoothed by BELIEF_SPREAD; undefined when the step has no usable detection.
 */
export function buildInjectionProposal(
  context: ReplayContext,
  step: number,
  pose: WeightedPoseSummary,
): InjectionProposal | undefined {
  const { landmarks, bundle, timeline } = context;
  const detections = bundle.detections;
  if (!landmarks || !detections) return undefined;
  const prior: BeliefPrior = {
    x: pose.x,
    y: pose.y,
    theta: pose.theta,
    sigma: Math.sqrt(BELIEF_SPREAD * BELIEF_SPREAD + 0.5 * (pose.covXX + pose.covYY)),
    headingSigma: Math.sqrt(BELIEF_HEADING_SPREAD * BELIEF_HEADING_SPREAD + pose.covTT),
  };
  const from = timeline.detectionStart[step];
  const table = buildMeasurementProposal(
    landmarks,
    detections,
    from,
    timeline.detectionStart[step + 1],
    prior,
  );
  return table ? { model: landmarks, detections, table, grid: bundle.map.grid } : undefined;
}

/**
 * Table 8.3 lines 12-15 for step `step` after resampling: replaces particles [0, state.count) with
 * probability `probability`. A bundle with landmarks and detections injects only at steps with a
 * detection (about every 0.2 s on the samples): uniform poses, which win at random whenever the
 * step has few beams (degraded-sensor: RMSE 1.9 m with them, 0.19 m without), are kept for bundles
 * without detections. `pose` is the step's belief summary. Returns the number replaced.
 */
export function injectRecoveryParticles(
  context: ReplayContext,
  state: ParticleState,
  step: number,
  probability: number,
  pose: WeightedPoseSummary,
  scratch: RandomScratch,
): number {
  if (probability <= 0) return 0;
  const hasDetections = Boolean(context.landmarks && context.bundle.detections);
  const proposal = hasDetections ? buildInjectionProposal(context, step, pose) : undefined;
  if (hasDetections && !proposal) return 0;
  const { seed } = context.settings;
  const { freeSpace } = context;
  return injectRandomParticles(
    freeSpace,
    state.x,
    state.y,
    state.theta,
    0,
    state.count,
    probability,
    seed,
    step,
    scratch,
    proposal,
  );
}
