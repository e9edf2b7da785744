/**
 * Weighted statistics of a particle set: mean pose (circular mean for the heading), covariance,
 * effective sample size and weight entropy. Map frame; m, rad.
 */
import { atan2 } from './numerics';
import { wrapAngle } from './stats';

/** Summary of a weighted particle set (normalised weights). */
export interface WeightedPoseSummary {
  x: number;
  y: number;
  /** Circular mean atan2(sum w sin, sum w cos), rad in (-pi, pi]. */
  theta: number;
  /** m^2 */
  covXX: number;
  covXY: number;
  covYY: number;
  /** rad^2, of the heading residuals wrapped around the circular mean. */
  covTT: number;
  /** 1 / sum(w^2) */
  ess: number;
  /** -sum(w ln w), nats */
  entropy: number;
}

export function createPoseSummary(): WeightedPoseSummary {
  return { x: 0, y: 0, theta: 0, covXX: 0, covXY: 0, covYY: 0, covTT: 0, ess: 0, entropy: 0 };
}

/**
 * Fills `out` from particles [0, n) with normalised `weights` (and their logs `logWeight`) and
 * precomputed heading cos/sin.
 * Fixed summation order (index order) keeps the result bit-reproducible.
 */
export function summarizeWeightedPoses(
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  cosTheta: Float64Array,
  sinTheta: Float64Array,
  weights: Float64Array,
  logWeight: Float64Array,
  n: number,
  out: WeightedPoseSummary,
): void {
  let meanX = 0;
  let meanY = 0;
  let sumCos = 0;
  let sumSin = 0;
  let sumSquares = 0;
  let entropy = 0;
  for (let i = 0; i < n; i++) {
    const w = weights[i];
    meanX += w * x[i];
    meanY += w * y[i];
    sumCos += w * cosTheta[i];
    sumSin += w * sinTheta[i];
    sumSquares += w * w;
    if (w > 0) entropy -= w * logWeight[i];
  }
  const meanTheta = atan2(sumSin, sumCos);
  let covXX = 0;
  let covXY = 0;
  let covYY = 0;
  let covTT = 0;
  for (let i = 0; i < n; i++) {
    const w = weights[i];
    const dx = x[i] - meanX;
    const dy = y[i] - meanY;
    let dt = theta[i] - meanTheta;
    if (dt > Math.PI || dt <= -Math.PI) dt = wrapAngle(dt);
    covXX += w * dx * dx;
    covXY += w * dx * dy;
    covYY += w * dy * dy;
    covTT += w * dt * dt;
  }
  out.x = meanX;
  out.y = meanY;
  out.theta = meanTheta;
  out.covXX = covXX;
  out.covXY = covXY;
  out.covYY = covYY;
  out.covTT = covTT;
  out.ess = 1 / sumSquares;
  out.entropy = entropy;
}

/** Weighted mean pose (m, m, rad; circular mean heading) into out[0..2]. */
export function weightedMeanPose(
  x: Float64Array,
  y: Float64Array,
  cosTheta: Float64Array,
  sinTheta: Float64Array,
  weights: Float64Array,
  n: number,
  out: Float64Array,
): void {
  let meanX = 0;
  let meanY = 0;
  let sumCos = 0;
  let sumSin = 0;
  for (let i = 0; i < n; i++) {
    const w = weights[i];
    meanX += w * x[i];
    meanY += w * y[i];
    sumCos += w * cosTheta[i];
    sumSin += w * sinTheta[i];
  }
  out[0] = meanX;
  out[1] = meanY;
  out[2] = atan2(sumSin, sumCos);
}
