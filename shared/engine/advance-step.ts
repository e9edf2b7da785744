/**
 * One full filter step on a single thread: motion, measurement weighting, log-sum-exp
 * normalisation, diagnostics, recovery averages, resampling (with optional KLD particle count)
 * and random-particle injection. Mutates the state; fills `workspace.record`.
 */

import { type ClusterScratch, countBeliefClusters, createClusterScratch } from './cluster-count';
import { createRangeScratch, type RangeScratch, runParticleStages } from './filter-step';
import { kldTargetCount } from './kld-sampling';
import { exp, log } from './numerics';
import type { ParticleState } from './particle-state';
import {
  createPoseSummary,
  summarizeWeightedPoses,
  type WeightedPoseSummary,
  weightedMeanPose,
} from './pose-statistics';
import { createRandomScratch } from './random';
import { injectionProbability, injectRecoveryParticles, updateLogAverage } from './recovery';
import type { ReplayContext } from './replay-context';
import { countDistinctAncestors, RESAMPLING_METHOD_CODE, resampleAncestors } from './resampling';
import { logSumExp } from './stats';

/** Outputs of one step; statistics are of the weighted set after the measurement update, before resampling. */
export interface StepRecord {
  t: number;
  pose: WeightedPoseSummary;
  /** Weighted mean before the measurement update (after motion), for the measurement correction. */
  predictedX: number;
  predictedY: number;
  predictedTheta: number;
  /** log sum_i w_i L_i with the pre-update weights; NaN when the step had no measurement. */
  logLikelihood: number;
  measurements: number;
  /** 0 = did not resample, else RESAMPLING_METHOD_CODE. */
  resampled: number;
  distinct: number;
  injected: number;
  /** Particle count after the step. */
  particles: number;
  clusters: number;
}

/**
 * Runs `runParticleStages` for step `step` over all `count` particles, split as the caller likes
 * (e.g. across worker threads sharing the state's buffers), and returns the measurement count.
 */
export type ParticleStagesRunner = (step: number, count: number) => number;

export interface StepWorkspace {
  /** Replaces the single-threaded per-particle stages when set. */
  particleStages?: ParticleStagesRunner;
  weights: Float64Array;
  stepLogLikelihood: Float64Array;
  cosTheta: Float64Array;
  sinTheta: Float64Array;
  spareX: Float64Array;
  spareY: Float64Array;
  spareTheta: Float64Array;
  ancestors: Int32Array;
  cumulative: Float64Array;
  residual: Float64Array;
  marks: Uint8Array;
  range: RangeScratch;
  clusters: ClusterScratch;
  /** Predicted (pre-update) mean pose x, y, theta. */
  predicted: Float64Array;
  /** Step after which `weights` equals exp(state.logWeight); -1 when unknown. */
  weightsStep: number;
  record: StepRecord;
}

export function createStepWorkspace(context: ReplayContext): StepWorkspace {
  const capacity = context.capacity;
  return {
    weights: new Float64Array(capacity),
    stepLogLikelihood: new Float64Array(capacity),
    cosTheta: new Float64Array(capacity),
    sinTheta: new Float64Array(capacity),
    spareX: new Float64Array(capacity),
    spareY: new Float64Array(capacity),
    spareTheta: new Float64Array(capacity),
    ancestors: new Int32Array(capacity),
    cumulative: new Float64Array(capacity),
    residual: new Float64Array(capacity),
    marks: new Uint8Array(capacity),
    range: createRangeScratch(context, createRandomScratch()),
    clusters: createClusterScratch(),
    predicted: new Float64Array(3),
    weightsStep: -1,
    record: {
      t: 0,
      pose: createPoseSummary(),
      predictedX: 0,
      predictedY: 0,
      predictedTheta: 0,
      logLikelihood: Number.NaN,
      measurements: 0,
      resampled: 0,
      distinct: 0,
      injected: 0,
      particles: 0,
      clusters: 0,
    },
  };
}

function exponentiateWeights(logWeight: Float64Array, n: number, weights: Float64Array): void {
  for (let i = 0; i < n; i++) weights[i] = exp(logWeight[i]);
}

/** Applies the measurement log-likelihoods and renormalises; returns the step log-likelihood. */
function updateWeights(state: ParticleState, increments: Float64Array): number {
  const n = state.count;
  const logWeight = state.logWeight;
  for (let i = 0; i < n; i++) logWeight[i] += increments[i];
  const normaliser = logSumExp(logWeight, n);
  if (!Number.isFinite(normaliser)) {
    // Every particle is impossible under the measurements: keep the set, forget the weights.
    logWeight.fill(-log(n), 0, n);
    return normaliser;
  }
  for (let i = 0; i < n; i++) logWeight[i] -= normaliser;
  return normaliser;
}

/** Draws the next generation into the spare buffers and swaps them in. */
function resampleState(
  context: ReplayContext,
  state: ParticleState,
  workspace: StepWorkspace,
  step: number,
): void {
  const { settings } = context;
  const n = state.count;
  const { weights, ancestors, cumulative, residual } = workspace;
  const random = workspace.range.random;
  const method = settings.resampling.method;
  let draws = settings.kld.enabled ? context.capacity : settings.particles;
  resampleAncestors(method, weights, n, draws, ancestors, settings.seed, step, cumulative, residual, random);
  if (settings.kld.enabled) {
    // Trial draw at full capacity gives the occupied bins; then the real draw at the KLD count.
    draws = kldTargetCount(state.x, state.y, state.theta, ancestors, draws, settings.kld);
    resampleAncestors(
      method,
      weights,
      n,
      draws,
      ancestors,
      settings.seed,
      step,
      cumulative,
      residual,
      random,
    );
  }
  const { spareX, spareY, spareTheta } = workspace;
  for (let j = 0; j < draws; j++) {
    const a = ancestors[j];
    spareX[j] = state.x[a];
    spareY[j] = state.y[a];
    spareTheta[j] = state.theta[a];
  }
  workspace.spareX = state.x;
  workspace.spareY = state.y;
  workspace.spareTheta = state.theta;
  state.x = spareX;
  state.y = spareY;
  state.theta = spareTheta;
  state.count = draws;
  state.logWeight.fill(-log(draws), 0, draws);
  workspace.weights.fill(exp(-log(draws)), 0, draws);
  workspace.record.distinct = countDistinctAncestors(ancestors, draws, workspace.marks, n);
}

/**
 * Advances `state` (which holds the result of step `step - 1`, or the initial belief for step 0)
 * through step `step`. With `withDiagnostics` false only what the state needs is computed
 * (used when re-simulating from a keyframe); the state evolves identically either way.
 */
export function advanceStep(
  context: ReplayContext,
  state: ParticleState,
  workspace: StepWorkspace,
  step: number,
  withDiagnostics: boolean,
): StepRecord {
  const { settings } = context;
  const record = workspace.record;
  const { weights, cosTheta, sinTheta, stepLogLikelihood } = workspace;
  let n = state.count;
  const measurements = workspace.particleStages
    ? workspace.particleStages(step, n)
    : runParticleStages(
        context,
        state,
        step,
        [0, n],
        { cosTheta, sinTheta, logLikelihood: stepLogLikelihood },
        workspace.range,
      );
  const predicted = workspace.predicted;
  if (withDiagnostics && measurements > 0) {
    // weights = exp(logWeight) already holds when this workspace ran the previous step.
    if (workspace.weightsStep !== step - 1) exponentiateWeights(state.logWeight, n, weights);
    weightedMeanPose(state.x, state.y, cosTheta, sinTheta, weights, n, predicted);
  }
  const logLikelihood = measurements > 0 ? updateWeights(state, stepLogLikelihood) : Number.NaN;
  exponentiateWeights(state.logWeight, n, weights);
  summarizeWeightedPoses(
    state.x,
    state.y,
    state.theta,
    cosTheta,
    sinTheta,
    weights,
    state.logWeight,
    n,
    record.pose,
  );
  if (measurements === 0) {
    predicted[0] = record.pose.x;
    predicted[1] = record.pose.y;
    predicted[2] = record.pose.theta;
  }
  record.predictedX = predicted[0];
  record.predictedY = predicted[1];
  record.predictedTheta = predicted[2];
  record.t = context.bundle.odometry.t[step];
  record.logLikelihood = logLikelihood;
  record.measurements = measurements;
  record.clusters = withDiagnostics
    ? countBeliefClusters(state.x, state.y, weights, n, workspace.clusters)
    : 0;
  if (settings.recovery.enabled && measurements > 0 && Number.isFinite(logLikelihood)) {
    const perMeasurement = logLikelihood / measurements;
    state.logSlow = updateLogAverage(state.logSlow, perMeasurement, settings.recovery.alpha_slow);
    state.logFast = updateLogAverage(state.logFast, perMeasurement, settings.recovery.alpha_fast);
  }
  record.resampled = 0;
  record.distinct = n;
  record.injected = 0;
  if (record.pose.ess < settings.resampling.threshold * n) {
    resampleState(context, state, workspace, step);
    record.resampled = RESAMPLING_METHOD_CODE[settings.resampling.method];
    n = state.count;
    if (settings.recovery.enabled) {
      const probability = injectionProbability(state.logSlow, state.logFast);
      const random = workspace.range.random;
      record.injected = injectRecoveryParticles(context, state, step, probability, record.pose, random);
    }
  }
  record.particles = n;
  state.step = step;
  workspace.weightsStep = step;
  return record;
}
