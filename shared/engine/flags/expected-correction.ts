/**
 * How much the measurement updates are expected to correct odometry on a healthy run, from the
 * filter's own motion model: per step, the variances the odometry model assigns to the increment
 * (Thrun, Burgard, Fox, Probabilistic Robotics, 2005, Table 5.6; alphas are variance
 * coefficients), summed over the same trailing window as the corrections. In a turn on the spot
 * a1 rot^2 dominates, so a tight turn is expected to need a larger heading correction than a
 * straight run; a slip on a straight stands out against a small expected spread.
 */
import type { OdometryTable } from '../../bundle/types';
import { decomposeOdometry, odometryNoiseSigmas } from '../motion-model';

/** Standard deviations (rad, m) of the summed odometry error over the trailing window, per step. */
export interface ExpectedCorrection {
  heading: Float64Array;
  position: Float64Array;
}

/**
 * Per step k >= 1, the spread of the odometry error accumulated over the trailing `windowSeconds`
 * seconds of `t`: heading sqrt(sum var(rot1) + var(rot2)); position sqrt(sum var(trans) +
 * trans^2 var(rot1)) (the along-track and, to first order, cross-track parts). Steps follow the
 * odometry timeline, so step k's increment is odometry row k-1 to row k.
 */
export function measureExpectedCorrection(
  t: Float64Array,
  odometry: OdometryTable,
  alpha: readonly [number, number, number, number],
  windowSeconds: number,
): ExpectedCorrection {
  const steps = t.length;
  const headingVariance = new Float64Array(steps);
  const positionVariance = new Float64Array(steps);
  const rows = Math.min(steps, odometry.t.length);
  for (let k = 1; k < rows; k++) {
    const increment = decomposeOdometry(
      odometry.x[k - 1],
      odometry.y[k - 1],
      odometry.theta[k - 1],
      odometry.x[k],
      odometry.y[k],
      odometry.theta[k],
    );
    const [rot1, trans, rot2] = odometryNoiseSigmas(increment, alpha);
    headingVariance[k] = rot1 * rot1 + rot2 * rot2;
    positionVariance[k] = trans * trans + increment.trans * increment.trans * rot1 * rot1;
  }
  const expected: ExpectedCorrection = {
    heading: new Float64Array(steps),
    position: new Float64Array(steps),
  };
  let first = 1;
  let sumHeading = 0;
  let sumPosition = 0;
  for (let k = 1; k < steps; k++) {
    sumHeading += headingVariance[k];
    sumPosition += positionVariance[k];
    while (t[first] <= t[k] - windowSeconds) {
      sumHeading -= headingVariance[first];
      sumPosition -= positionVariance[first];
      first++;
    }
    // Running sums can leave a tiny negative remainder after many subtractions.
    expected.heading[k] = Math.sqrt(Math.max(0, sumHeading));
    expected.position[k] = Math.sqrt(Math.max(0, sumPosition));
  }
  return expected;
}
