/**
 * Per-step diagnostics as one typed array per quantity (index = step). Definitions are in
 * docs/replay-engine.md; pose statistics are of the weighted particle set after the step's
 * measurement update and before resampling. Map frame; m, rad, s.
 */
import type { StepRecord } from './advance-step';

export interface ReplaySeries {
  /** Step time, s since manifest.start_time (the odometry reading's t). */
  t: Float64Array;
  x: Float64Array;
  y: Float64Array;
  theta: Float64Array;
  cov_xx: Float64Array;
  cov_xy: Float64Array;
  cov_yy: Float64Array;
  cov_tt: Float64Array;
  ess: Float64Array;
  /** nats */
  entropy: Float64Array;
  /** log sum_i w_i L_i (the normaliser); NaN when the step had no measurement. */
  log_likelihood: Float64Array;
  /** Beams used plus detections in the step. */
  measurements: Int32Array;
  /** Mean pose change made by the measurement update (posterior mean minus predicted mean). */
  correction_x: Float64Array;
  correction_y: Float64Array;
  correction_theta: Float64Array;
  /** 0 = no resampling, 1 multinomial, 2 stratified, 3 systematic, 4 residual. */
  resampled: Uint8Array;
  /** Distinct ancestors kept by resampling (the particle count when not resampled). */
  distinct: Int32Array;
  injected: Int32Array;
  particles: Int32Array;
  clusters: Int32Array;
  /** Distance (m) and heading difference (rad, replay minus reference) to reference_pose; NaN when absent. */
  error_reference: Float64Array;
  heading_error_reference: Float64Array;
  /** Same against onboard_pose. */
  error_onboard: Float64Array;
  heading_error_onboard: Float64Array;
  /** Normalised estimation error squared of the onboard pose vs the replay under the onboard covariance (3 dof). */
  nees_onboard: Float64Array;
}

export function createReplaySeries(steps: number): ReplaySeries {
  const float = () => new Float64Array(steps);
  const int = () => new Int32Array(steps);
  return {
    t: float(),
    x: float(),
    y: float(),
    theta: float(),
    cov_xx: float(),
    cov_xy: float(),
    cov_yy: float(),
    cov_tt: float(),
    ess: float(),
    entropy: float(),
    log_likelihood: float(),
    measurements: int(),
    correction_x: float(),
    correction_y: float(),
    correction_theta: float(),
    resampled: new Uint8Array(steps),
    distinct: int(),
    injected: int(),
    particles: int(),
    clusters: int(),
    error_reference: float().fill(Number.NaN),
    heading_error_reference: float().fill(Number.NaN),
    error_onboard: float().fill(Number.NaN),
    heading_error_onboard: float().fill(Number.NaN),
    nees_onboard: float().fill(Number.NaN),
  };
}

/** Stores one step's record at index `step`. */
export function storeStepRecord(series: ReplaySeries, step: number, record: StepRecord): void {
  const pose = record.pose;
  series.t[step] = record.t;
  series.x[step] = pose.x;
  series.y[step] = pose.y;
  series.theta[step] = pose.theta;
  series.cov_xx[step] = pose.covXX;
  series.cov_xy[step] = pose.covXY;
  series.cov_yy[step] = pose.covYY;
  series.cov_tt[step] = pose.covTT;
  series.ess[step] = pose.ess;
  series.entropy[step] = pose.entropy;
  series.log_likelihood[step] = record.logLikelihood;
  series.measurements[step] = record.measurements;
  series.correction_x[step] = pose.x - record.predictedX;
  series.correction_y[step] = pose.y - record.predictedY;
  let dTheta = pose.theta - record.predictedTheta;
  if (dTheta > Math.PI) dTheta -= 2 * Math.PI;
  else if (dTheta <= -Math.PI) dTheta += 2 * Math.PI;
  series.correction_theta[step] = dTheta;
  series.resampled[step] = record.resampled;
  series.distinct[step] = record.distinct;
  series.injected[step] = record.injected;
  series.particles[step] = record.particles;
  series.clusters[step] = record.clusters;
}
