/**
 * Scan endpoints at the replay's weighted-mean pose, and the map-disagreement count: how often
 * those endpoints land on cells the map says are free and far from any obstacle.
 */

import { CELL_FREE } from '../bundle/types';
import { robotFrameEndpoints } from './likelihood-field';
import { cos, sin } from './numerics';
import type { ReplayContext } from './replay-context';
import type { ReplaySeries } from './replay-series';

/** An endpoint counts as disagreeing when its cell is free and further than this many sigma_hit from any occupied cell. */
export const DISAGREEMENT_SIGMAS = 3;

/**
 * Map-frame endpoints (m) of the used beams of every scan applied at `step`, placed by the mean
 * pose of that step: [x0, y0, x1, y1, ...]. Empty when the step has no scan or scans are not used.
 */
export function scanEndpointsAt(context: ReplayContext, series: ReplaySeries, step: number): Float64Array {
  const { bundle, beams, timeline } = context;
  const scan = bundle.manifest.scan;
  if (!beams || !bundle.scans || !scan || step < 0 || step >= timeline.steps) return new Float64Array(0);
  const first = timeline.scanStart[step];
  const last = timeline.scanStart[step + 1];
  const endX = new Float64Array(beams.indices.length);
  const endY = new Float64Array(beams.indices.length);
  const out = new Float64Array(2 * beams.indices.length * (last - first));
  const c = cos(series.theta[step]);
  const s = sin(series.theta[step]);
  let written = 0;
  for (let scanIndex = first; scanIndex < last; scanIndex++) {
    const count = robotFrameEndpoints(bundle.scans.ranges, scanIndex, scan, beams, endX, endY);
    for (let k = 0; k < count; k++) {
      out[written++] = series.x[step] + c * endX[k] - s * endY[k];
      out[written++] = series.y[step] + s * endX[k] + c * endY[k];
    }
  }
  return out.slice(0, written);
}

/**
 * Per-cell count (map row order, row 0 northmost, like `grid.cells`) of mean-pose scan endpoints
 * that fell on free cells more than DISAGREEMENT_SIGMAS * sigma_hit from any occupied cell, over
 * steps [0, steps). Empty without a grid or scans.
 */
export function countMapDisagreement(
  context: ReplayContext,
  series: ReplaySeries,
  steps: number,
): Uint32Array {
  const { field, bundle } = context;
  const grid = bundle.map.grid;
  if (!field || !grid || !context.settings.scan_model) return new Uint32Array(0);
  const counts = new Uint32Array(grid.width * grid.height);
  const threshold = DISAGREEMENT_SIGMAS * context.settings.scan_model.sigma_hit;
  for (let step = 0; step < steps; step++) {
    const endpoints = scanEndpointsAt(context, series, step);
    for (let e = 0; e < endpoints.length; e += 2) {
      const column = Math.floor((endpoints[e] - field.originX) * field.inverseResolution);
      const southRow = Math.floor((endpoints[e + 1] - field.originY) * field.inverseResolution);
      if (column < 0 || column >= field.width || southRow < 0 || southRow >= field.height) continue;
      if (field.distance[southRow * field.width + column] <= threshold) continue;
      const mapIndex = (field.height - 1 - southRow) * field.width + column;
      if (grid.cells[mapIndex] === CELL_FREE) counts[mapIndex]++;
    }
  }
  return counts;
}
