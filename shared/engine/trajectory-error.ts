/**
 * Error of the replay's mean pose against the reference trajectory and the onboard estimate,
 * with those tables linearly interpolated in time (heading along the shorter arc); NaN outside
 * their time span. Onboard NEES uses the onboard covariance (x-y block plus heading variance,
 * x/y-heading cross terms taken as zero, as the format does not carry them).
 */
import type { Bundle, PoseColumns } from '../bundle/types';
import type { ReplaySeries } from './replay-series';
import { chiSquareQuantile, wrapAngle } from './stats';

/** 95 % chi-square bound for the 3-dof onboard NEES (NIST/SEMATECH table: 7.815). */
export const NEES_BOUND_95 = chiSquareQuantile(0.95, 3);

/** Interpolation position of time t in a sorted time column: index j and fraction f in [0, 1], or j = -1. */
function locate(times: Float64Array, t: number, cursor: { j: number }): { j: number; f: number } {
  const last = times.length - 1;
  if (last < 0 || t < times[0] || t > times[last]) return { j: -1, f: 0 };
  if (last === 0) return { j: 0, f: 0 };
  let j = Math.min(Math.max(cursor.j, 0), last - 1);
  if (times[j] > t) j = 0;
  while (j < last - 1 && times[j + 1] < t) j++;
  cursor.j = j;
  const span = times[j + 1] - times[j];
  return { j, f: span > 0 ? (t - times[j]) / span : 0 };
}

function lerp(column: Float64Array, j: number, f: number): number {
  return f === 0 ? column[j] : column[j] + f * (column[j + 1] - column[j]);
}

function lerpAngle(column: Float64Array, j: number, f: number): number {
  return f === 0 ? column[j] : wrapAngle(column[j] + f * wrapAngle(column[j + 1] - column[j]));
}

/** Fills position and heading errors of the series' mean poses against `table`. */
function fillErrors(
  series: ReplaySeries,
  table: PoseColumns,
  distance: Float64Array,
  heading: Float64Array,
): void {
  const cursor = { j: 0 };
  for (let k = 0; k < series.t.length; k++) {
    const { j, f } = locate(table.t, series.t[k], cursor);
    if (j < 0) continue;
    const dx = series.x[k] - lerp(table.x, j, f);
    const dy = series.y[k] - lerp(table.y, j, f);
    distance[k] = Math.sqrt(dx * dx + dy * dy);
    heading[k] = wrapAngle(series.theta[k] - lerpAngle(table.theta, j, f));
  }
}

/** Fills the error and NEES columns of `series` from the bundle's reference and onboard tables. */
export function computeTrajectoryErrors(series: ReplaySeries, bundle: Bundle): void {
  if (bundle.reference)
    fillErrors(series, bundle.reference, series.error_reference, series.heading_error_reference);
  const onboard = bundle.onboard;
  if (!onboard) return;
  fillErrors(series, onboard, series.error_onboard, series.heading_error_onboard);
  const cov = onboard.cov;
  if (!cov) return;
  const cursor = { j: 0 };
  for (let k = 0; k < series.t.length; k++) {
    const { j, f } = locate(onboard.t, series.t[k], cursor);
    if (j < 0) continue;
    const ex = lerp(onboard.x, j, f) - series.x[k];
    const ey = lerp(onboard.y, j, f) - series.y[k];
    const et = wrapAngle(lerpAngle(onboard.theta, j, f) - series.theta[k]);
    const xx = lerp(cov.xx, j, f);
    const xy = lerp(cov.xy, j, f);
    const yy = lerp(cov.yy, j, f);
    const tt = lerp(cov.tt, j, f);
    const determinant = xx * yy - xy * xy;
    if (!(determinant > 0 && tt > 0)) continue;
    series.nees_onboard[k] = (yy * ex * ex - 2 * xy * ex * ey + xx * ey * ey) / determinant + (et * et) / tt;
  }
}

/** Root mean square of the finite entries of `errors` (m); null when there are none. */
export function rootMeanSquare(errors: Float64Array): number | null {
  let sum = 0;
  let count = 0;
  for (const e of errors) {
    if (Number.isFinite(e)) {
      sum += e * e;
      count++;
    }
  }
  return count > 0 ? Math.sqrt(sum / count) : null;
}
