/**
 * The two per-particle stages of a step, written over a particle index range [from, to) so a step
 * can be split across worker threads: every particle's result depends only on its own state, the
 * shared read-only context and counter-keyed random numbers.
 */

import {
  accumulateDetectionLogLikelihood,
  createDetectionScratch,
  type DetectionScratch,
} from './landmark-association';
import { accumulateScanLogLikelihood, robotFrameEndpoints } from './likelihood-field';
import { decomposeOdometry, sampleOdometryMotion } from './motion-model';
import { cos, sin } from './numerics';
import type { ParticleState } from './particle-state';
import type { RandomScratch } from './random';
import type { ReplayContext } from './replay-context';

/** Per-thread scratch for the range stages. */
export interface RangeScratch {
  random: RandomScratch;
  /** Robot-frame beam endpoints of the scan being applied (m), length = beams used. */
  endX: Float64Array;
  endY: Float64Array;
  detections: DetectionScratch;
}

export function createRangeScratch(context: ReplayContext, random: RandomScratch): RangeScratch {
  const beams = context.beams?.indices.length ?? 0;
  return {
    random,
    endX: new Float64Array(beams),
    endY: new Float64Array(beams),
    detections: createDetectionScratch(context.landmarks, context.capacity),
  };
}

/**
 * Applies the odometry increment of step `step` (>= 1) to particles [from, to), sampled by the
 * odometry motion model; when given, `cosTheta`/`sinTheta` receive the new headings' cos and sin.
 */
export function moveParticleRange(
  context: ReplayContext,
  state: ParticleState,
  step: number,
  from: number,
  to: number,
  scratch: RangeScratch,
  cosTheta?: Float64Array,
  sinTheta?: Float64Array,
): void {
  const odometry = context.bundle.odometry;
  const increment = decomposeOdometry(
    odometry.x[step - 1],
    odometry.y[step - 1],
    odometry.theta[step - 1],
    odometry.x[step],
    odometry.y[step],
    odometry.theta[step],
  );
  const { alpha } = context.settings.motion;
  sampleOdometryMotion(
    state.x,
    state.y,
    state.theta,
    from,
    to,
    increment,
    alpha,
    context.settings.seed,
    step,
    scratch.random,
    cosTheta,
    sinTheta,
  );
}

/** Writes cos and sin of each particle heading in [from, to). */
export function computeHeadingTrig(
  theta: Float64Array,
  from: number,
  to: number,
  cosTheta: Float64Array,
  sinTheta: Float64Array,
): void {
  for (let i = from; i < to; i++) {
    cosTheta[i] = cos(theta[i]);
    sinTheta[i] = sin(theta[i]);
  }
}

/**
 * Adds the log-likelihood of all scans and detections of step `step` to out[i] for particles
 * [from, to) (out must be zeroed by the caller). Returns the number of measurements used
 * (valid beams plus detections), which is the same for every particle.
 */
export function weighParticleRange(
  context: ReplayContext,
  state: ParticleState,
  step: number,
  from: number,
  to: number,
  cosTheta: Float64Array,
  sinTheta: Float64Array,
  out: Float64Array,
  scratch: RangeScratch,
): number {
  const { bundle, timeline, field, beams, landmarks } = context;
  let measurements = 0;
  if (field && beams && bundle.scans && bundle.manifest.scan) {
    for (let s = timeline.scanStart[step]; s < timeline.scanStart[step + 1]; s++) {
      const count = robotFrameEndpoints(
        bundle.scans.ranges,
        s,
        bundle.manifest.scan,
        beams,
        scratch.endX,
        scratch.endY,
      );
      if (count === 0) continue;
      accumulateScanLogLikelihood(
        field,
        state.x,
        state.y,
        cosTheta,
        sinTheta,
        from,
        to,
        scratch.endX,
        scratch.endY,
        count,
        out,
      );
      measurements += count;
    }
  }
  const detections = bundle.detections;
  if (landmarks && detections) {
    const first = timeline.detectionStart[step];
    const end = timeline.detectionStart[step + 1];
    accumulateDetectionLogLikelihood(
      landmarks,
      { x: state.x, y: state.y, theta: state.theta, cosTheta, sinTheta },
      from,
      to,
      { classIndex: detections.classIndex, range: detections.range, bearing: detections.bearing, first, end },
      out,
      scratch.detections,
    );
    measurements += end - first;
  }
  return measurements;
}

/** The per-particle outputs of a step that later stages read (length >= particle count). */
export interface StageBuffers {
  /** cos and sin of each particle's heading after motion. */
  cosTheta: Float64Array;
  sinTheta: Float64Array;
  /** Each particle's measurement log-likelihood for the step. */
  logLikelihood: Float64Array;
}

/**
 * Every per-particle stage of step `step` over particles [from, to): motion (step >= 1), heading
 * cos/sin, and the measurement log-likelihoods (zeroed here first). Returns the number of
 * measurements used. The unit of work of a thread when a step is split.
 */
export function runParticleStages(
  context: ReplayContext,
  state: ParticleState,
  step: number,
  range: readonly [from: number, to: number],
  buffers: StageBuffers,
  scratch: RangeScratch,
): number {
  const [from, to] = range;
  const { cosTheta, sinTheta, logLikelihood } = buffers;
  if (step > 0) moveParticleRange(context, state, step, from, to, scratch, cosTheta, sinTheta);
  else computeHeadingTrig(state.theta, from, to, cosTheta, sinTheta);
  logLikelihood.fill(0, from, to);
  return weighParticleRange(context, state, step, from, to, cosTheta, sinTheta, logLikelihood, scratch);
}
