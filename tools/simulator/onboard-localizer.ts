import { composePose, type Pose } from './pose-math';
import type { RandomSource } from './random-source';

export type OnboardMode = 'tracking' | 'dead-reckoning' | 'offset';

/** Covariance the onboard localizer reports (m², m², m², rad²). */
export interface OnboardCovariance {
  xx: number;
  xy: number;
  yy: number;
  tt: number;
}

const TRACKING_SIGMA_XY = 0.02;
const TRACKING_SIGMA_THETA = 0.008;
/** Correlation of the tracking error from one 0.1 s step to the next. */
const TRACKING_CORRELATION = 0.9;
/** Reported covariance while it thinks all is well; it barely grows afterwards (over-confidence). */
const REPORTED_VAR_XY = 0.025 ** 2;
const REPORTED_VAR_THETA = 0.01 ** 2;
const REPORTED_GROWTH_PER_STEP = 2e-6;

/**
 * What an under-tuned onboard localizer believed. While healthy it follows the truth with a
 * small, slowly varying error. After a fault it either dead-reckons on the (possibly corrupted)
 * odometry, or locks onto a wrong scan match (`offset`), while reporting a covariance that stays
 * small: the mismatch between the confident estimate and the truth is what investigators look for.
 */
export class OnboardLocalizer {
  mode: OnboardMode = 'tracking';
  belief: Pose;
  private error: Pose = { x: 0, y: 0, theta: 0 };
  private offsetTarget: Pose = { x: 0, y: 0, theta: 0 };
  private offsetFraction = 0;
  private offsetRampPerStep = 0;
  private extraVariance = 0;

  constructor(
    truth: Pose,
    private readonly random: RandomSource,
  ) {
    this.belief = { ...truth };
  }

  startDeadReckoning(): void {
    this.mode = 'dead-reckoning';
  }

  /** Locks onto a wrong match: the error grows to `offset` (map frame, m and rad) over `rampSteps` steps. */
  startOffset(offset: Pose, rampSteps: number): void {
    this.mode = 'offset';
    this.offsetTarget = offset;
    this.offsetFraction = 0;
    this.offsetRampPerStep = 1 / Math.max(1, rampSteps);
  }

  /** An operator re-localized the robot: the estimate snaps back to the truth. */
  relocalize(truth: Pose): void {
    this.mode = 'tracking';
    this.extraVariance = 0;
    this.belief = composePose(truth, this.error);
  }

  /** Advances one step given the new true pose and the odometry increment (robot frame). */
  update(truth: Pose, odometryDelta: Pose): void {
    const rho = TRACKING_CORRELATION;
    const innovation = Math.sqrt(1 - rho * rho);
    this.error = {
      x: rho * this.error.x + innovation * TRACKING_SIGMA_XY * this.random.standardNormal(),
      y: rho * this.error.y + innovation * TRACKING_SIGMA_XY * this.random.standardNormal(),
      theta: rho * this.error.theta + innovation * TRACKING_SIGMA_THETA * this.random.standardNormal(),
    };
    if (this.mode === 'tracking') {
      this.belief = composePose(truth, this.error);
      return;
    }
    this.extraVariance += REPORTED_GROWTH_PER_STEP;
    if (this.mode === 'dead-reckoning') {
      this.belief = composePose(this.belief, odometryDelta);
      return;
    }
    this.offsetFraction = Math.min(1, this.offsetFraction + this.offsetRampPerStep);
    const f = this.offsetFraction;
    const shifted = {
      x: truth.x + f * this.offsetTarget.x,
      y: truth.y + f * this.offsetTarget.y,
      theta: truth.theta + f * this.offsetTarget.theta,
    };
    this.belief = composePose(shifted, this.error);
  }

  get covariance(): OnboardCovariance {
    return {
      xx: REPORTED_VAR_XY + this.extraVariance,
      xy: 0,
      yy: REPORTED_VAR_XY + this.extraVariance,
      tt: REPORTED_VAR_THETA + this.extraVariance,
    };
  }
}
