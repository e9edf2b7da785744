/**
 * Where the scans say the robot is: a coarse-to-fine grid search, around the replay's mean pose,
 * for the pose under which a step's last scan fits the likelihood field best. The offset from
 * the mean pose is what the scans disagree with (the mean pose follows odometry between updates).
 */

import { accumulateScanLogLikelihood, robotFrameEndpoints } from '../likelihood-field';
import { cos, hypot, sin } from '../numerics';
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';

/** Coarse search: +-1 m in 0.2 m steps, +-0.3 rad in 0.1 rad steps; then +-0.1 m / +-0.05 rad at half steps. */
const COARSE_XY = { half: 5, step: 0.2 };
const COARSE_THETA = { half: 3, step: 0.1 };
const FINE_XY = { half: 2, step: 0.05 };
const FINE_THETA = { half: 2, step: 0.025 };
/**
 * Weak prior toward the mean pose, in nats per endpoint per metre (heading: per 0.2 rad). Along a
 * featureless aisle many offsets fit equally well; without it the search would report the far
 * end of the grid instead of no offset.
 */
const OFFSET_PRIOR = 0.05;
const HEADING_PRIOR_SCALE = 0.2;

export interface ScanOffset {
  /** Map-frame offset (m, m, rad) of the best-fitting pose from the replay's mean pose. */
  dx: number;
  dy: number;
  dtheta: number;
  /** Log-likelihood gain per endpoint (nats) of the best pose over the mean pose. */
  gainPerEndpoint: number;
  /** Usable endpoints in the scan. */
  endpoints: number;
}

export interface ScanMatchWorkspace {
  endX: Float64Array;
  endY: Float64Array;
  x: Float64Array;
  y: Float64Array;
  cos: Float64Array;
  sin: Float64Array;
  theta: Float64Array;
  score: Float64Array;
}

export function createScanMatchWorkspace(beams: number): ScanMatchWorkspace {
  const side = 2 * COARSE_XY.half + 1;
  const candidates = side * side * (2 * COARSE_THETA.half + 1);
  const make = () => new Float64Array(candidates);
  return {
    endX: new Float64Array(beams),
    endY: new Float64Array(beams),
    x: make(),
    y: make(),
    cos: make(),
    sin: make(),
    theta: make(),
    score: make(),
  };
}

/**
 * Scores a grid of poses centred on `centre`; returns the index of the best after the prior
 * toward `origin` (the mean pose), first on ties.
 */
function scoreGrid(
  context: ReplayContext,
  work: ScanMatchWorkspace,
  count: number,
  origin: [number, number, number],
  centre: [number, number, number],
  xy: { half: number; step: number },
  angle: { half: number; step: number },
): number {
  let m = 0;
  for (let a = -angle.half; a <= angle.half; a++) {
    const theta = centre[2] + a * angle.step;
    for (let i = -xy.half; i <= xy.half; i++) {
      for (let j = -xy.half; j <= xy.half; j++) {
        work.x[m] = centre[0] + i * xy.step;
        work.y[m] = centre[1] + j * xy.step;
        work.theta[m] = theta;
        work.cos[m] = cos(theta);
        work.sin[m] = sin(theta);
        work.score[m] = 0;
        m++;
      }
    }
  }
  accumulateScanLogLikelihood(
    context.field!,
    work.x,
    work.y,
    work.cos,
    work.sin,
    0,
    m,
    work.endX,
    work.endY,
    count,
    work.score,
  );
  let best = 0;
  let bestScore = Number.NEGATIVE_INFINITY;
  for (let c = 0; c < m; c++) {
    const away =
      hypot(work.x[c] - origin[0], work.y[c] - origin[1]) +
      Math.abs(work.theta[c] - origin[2]) / HEADING_PRIOR_SCALE;
    const penalised = work.score[c] - OFFSET_PRIOR * count * away;
    if (penalised > bestScore) {
      bestScore = penalised;
      best = c;
    }
  }
  return best;
}

/**
 * Best-fitting offset for the last scan of `step`, or undefined when the step has no scan, scans
 * are not used, or fewer than `minEndpoints` beams returned.
 */
export function findScanOffset(
  context: ReplayContext,
  series: ReplaySeries,
  step: number,
  work: ScanMatchWorkspace,
  minEndpoints: number,
): ScanOffset | undefined {
  const { bundle, beams, field, timeline } = context;
  const scan = bundle.manifest.scan;
  if (!beams || !field || !bundle.scans || !scan) return undefined;
  const last = timeline.scanStart[step + 1] - 1;
  if (last < timeline.scanStart[step]) return undefined;
  const count = robotFrameEndpoints(bundle.scans.ranges, last, scan, beams, work.endX, work.endY);
  if (count < minEndpoints) return undefined;
  const mean: [number, number, number] = [series.x[step], series.y[step], series.theta[step]];
  const baseline = new Float64Array(1);
  accumulateScanLogLikelihood(
    field,
    new Float64Array([mean[0]]),
    new Float64Array([mean[1]]),
    new Float64Array([cos(mean[2])]),
    new Float64Array([sin(mean[2])]),
    0,
    1,
    work.endX,
    work.endY,
    count,
    baseline,
  );
  const coarse = scoreGrid(context, work, count, mean, mean, COARSE_XY, COARSE_THETA);
  const fine = scoreGrid(
    context,
    work,
    count,
    mean,
    [work.x[coarse], work.y[coarse], work.theta[coarse]],
    FINE_XY,
    FINE_THETA,
  );
  return {
    dx: work.x[fine] - mean[0],
    dy: work.y[fine] - mean[1],
    dtheta: work.theta[fine] - mean[2],
    gainPerEndpoint: (work.score[fine] - baseline[0]) / count,
    endpoints: count,
  };
}
