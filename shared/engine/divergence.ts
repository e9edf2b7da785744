/**
 * When the replay lost the robot: the first step time after which the distance to the reference
 * trajectory stayed above a threshold for a minimum time.
 */

/** Distance (m) beyond which the replay counts as lost: well above the about 0.05 m RMSE of healthy tracking. */
export const DIVERGENCE_DISTANCE = 0.5;
/** The distance must stay above the threshold for at least this long (s), so brief excursions do not count. */
export const DIVERGENCE_HOLD = 2;

/**
 * First time t[k] (s since start_time) such that `errorReference` (m, replay mean to reference) is
 * above `distance` at every step from k through a step at least `hold` seconds later; null if never
 * or without a reference (NaN entries break a stretch).
 */
export function findDivergenceTime(
  t: Float64Array,
  errorReference: Float64Array,
  distance = DIVERGENCE_DISTANCE,
  hold = DIVERGENCE_HOLD,
): number | null {
  let start = -1;
  for (let k = 0; k < t.length; k++) {
    if (errorReference[k] > distance) {
      if (start < 0) start = k;
      if (t[k] - t[start] >= hold) return t[start];
    } else start = -1;
  }
  return null;
}
