/**
 * Whether a step's scan still agrees with the map at the replay's mean pose: the share of
 * endpoints that either fit an obstacle (within sigma_hit) or land on far free cells, where an
 * unmapped object explains them (map_out_of_date reports those). When nearly the whole scan is
 * explained this way, a dip in evidence or ESS is the filter's own sampling at work (a tight turn,
 * a person beside the robot), not a sensor fault or a lost robot.
 */
import type { FreeSpaceEndpointCounts } from './map-out-of-date';

/** Explained share at or above which a step's scan counts as agreeing with the map (healthy runs: mostly 0.9-1.0). */
export const EXPLAINED_SCAN_SHARE = 0.8;
/**
 * ... of which at least this share must fit an obstacle: after a push the mean pose is off and
 * many endpoints land on free cells too, which an unmapped object must not be taken to explain.
 */
export const FITTING_SCAN_SHARE = 0.7;
/** Fewer endpoints than this say too little either way. */
const MIN_ENDPOINTS = 20;

/** Share of the step's endpoints that fit an obstacle or land far out on free cells; NaN without a scan. */
export function explainedScanShare(counts: FreeSpaceEndpointCounts, step: number): number {
  const total = counts.total[step];
  if (total < MIN_ENDPOINTS) return Number.NaN;
  return (counts.fitting[step] + counts.free[step]) / total;
}

/** True when the step's scan is explained by the map plus unmapped objects (see above). */
export function isScanExplained(counts: FreeSpaceEndpointCounts | undefined, step: number): boolean {
  if (!counts) return false;
  return (
    explainedScanShare(counts, step) >= EXPLAINED_SCAN_SHARE &&
    counts.fitting[step] >= FITTING_SCAN_SHARE * counts.total[step]
  );
}
