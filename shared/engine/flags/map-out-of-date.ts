/**
 * map_out_of_date: while most of each scan still fits the map (so the pose is right), a steady
 * share of endpoints lands on cells the map says are free and far from any obstacle: something
 * stands where the map has nothing (a moved rack, a parked pallet).
 */
import { CELL_FREE } from '../../bundle/types';
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import { DISAGREEMENT_SIGMAS, scanEndpointsAt } from '../scan-endpoints';
import type { ReplayFlag } from './flag-types';
import { findSustainedRuns, fixed, runSeconds } from './intervals';

/** Steps with fewer endpoints than this carry too little to judge (sensor problems are flagged elsewhere). */
export const MAP_MIN_ENDPOINTS = 20;
/** At least this share of endpoints within sigma_hit of an obstacle, i.e. the pose is right. */
export const MAP_MIN_FIT_SHARE = 0.5;
/** With a reference trajectory, steps whose replay is further than this (m) are skipped: a wrong pose, not a wrong map. */
export const MAP_MAX_REFERENCE_ERROR = 0.3;
/** Trailing window (s) for the share of free-space endpoints. */
export const MAP_WINDOW = 1;
/** Windowed free-space share that marks a step (healthy samples: at most 1.3 %). */
export const MAP_FREE_SHARE = 0.08;
/** Peak share making the flag critical, when it also lasts MAP_CRITICAL_DURATION s. */
export const MAP_CRITICAL_SHARE = 0.2;
export const MAP_CRITICAL_DURATION = 3;
export const MAP_MIN_DURATION = 1;
export const MAP_MAX_GAP = 1;

/** Per-step endpoint counts at the mean pose. */
export interface FreeSpaceEndpointCounts {
  /** Endpoints on free cells more than DISAGREEMENT_SIGMAS * sigma_hit from any occupied cell. */
  free: Int32Array;
  /** Endpoints within sigma_hit of an occupied cell. */
  fitting: Int32Array;
  total: Int32Array;
  /** Sums of the free endpoints' map coordinates (m), for where they landed. */
  sumX: Float64Array;
  sumY: Float64Array;
}

/** Counts, per step, mean-pose scan endpoints on far free cells (see countMapDisagreement for the per-cell view). */
export function countFreeSpaceEndpoints(
  context: ReplayContext,
  series: ReplaySeries,
): FreeSpaceEndpointCounts {
  const steps = series.t.length;
  const counts: FreeSpaceEndpointCounts = {
    free: new Int32Array(steps),
    fitting: new Int32Array(steps),
    total: new Int32Array(steps),
    sumX: new Float64Array(steps),
    sumY: new Float64Array(steps),
  };
  const { field } = context;
  const grid = context.bundle.map.grid;
  const model = context.settings.scan_model;
  if (!field || !grid || !model) return counts;
  const far = DISAGREEMENT_SIGMAS * model.sigma_hit;
  for (let step = 0; step < steps; step++) {
    const endpoints = scanEndpointsAt(context, series, step);
    counts.total[step] = endpoints.length / 2;
    for (let e = 0; e < endpoints.length; e += 2) {
      const column = Math.floor((endpoints[e] - field.originX) * field.inverseResolution);
      const southRow = Math.floor((endpoints[e + 1] - field.originY) * field.inverseResolution);
      if (column < 0 || column >= field.width || southRow < 0 || southRow >= field.height) continue;
      const distance = field.distance[southRow * field.width + column];
      if (distance <= model.sigma_hit) counts.fitting[step]++;
      else if (
        distance > far &&
        grid.cells[(field.height - 1 - southRow) * field.width + column] === CELL_FREE
      ) {
        counts.free[step]++;
        counts.sumX[step] += endpoints[e];
        counts.sumY[step] += endpoints[e + 1];
      }
    }
  }
  return counts;
}

/** Flags intervals where scans keep showing obstacles the map does not have. */
export function detectMapOutOfDate(series: ReplaySeries, counts: FreeSpaceEndpointCounts): ReplayFlag[] {
  const steps = series.t.length;
  const usable = new Uint8Array(steps);
  for (let k = 0; k < steps; k++) {
    const total = counts.total[k];
    const poseIsWrong = series.error_reference[k] > MAP_MAX_REFERENCE_ERROR;
    usable[k] =
      total >= MAP_MIN_ENDPOINTS && counts.fitting[k] >= MAP_MIN_FIT_SHARE * total && !poseIsWrong ? 1 : 0;
  }
  const share = new Float64Array(steps);
  const marked = new Uint8Array(steps);
  let first = 0;
  let free = 0;
  let total = 0;
  for (let k = 0; k < steps; k++) {
    if (usable[k]) {
      free += counts.free[k];
      total += counts.total[k];
    }
    while (series.t[first] <= series.t[k] - MAP_WINDOW) {
      if (usable[first]) {
        free -= counts.free[first];
        total -= counts.total[first];
      }
      first++;
    }
    share[k] = total > 0 ? free / total : 0;
    // The step itself must show free-space endpoints, so the window's tail does not stretch the flag.
    if (usable[k] && counts.free[k] > 0 && share[k] >= MAP_FREE_SHARE) marked[k] = 1;
  }
  return findSustainedRuns(series.t, marked, MAP_MIN_DURATION, MAP_MAX_GAP).map((run) => {
    let peak = 0;
    let freeSum = 0;
    let totalSum = 0;
    let x = 0;
    let y = 0;
    for (let k = run.first; k <= run.last; k++) {
      peak = Math.max(peak, share[k]);
      if (!usable[k]) continue;
      freeSum += counts.free[k];
      totalSum += counts.total[k];
      x += counts.sumX[k];
      y += counts.sumY[k];
    }
    const seconds = runSeconds(series.t, run);
    const critical = peak >= MAP_CRITICAL_SHARE && seconds >= MAP_CRITICAL_DURATION;
    const where = freeSum > 0 ? `, centred near (${fixed(x / freeSum)}, ${fixed(y / freeSum)}) m` : '';
    return {
      kind: 'map_out_of_date',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: critical ? 'critical' : 'warning',
      evidence:
        `For ${fixed(seconds)} s ${fixed((100 * freeSum) / Math.max(1, totalSum), 0)} % of scan endpoints ` +
        `(peak ${fixed(peak * 100, 0)} % per ${MAP_WINDOW} s) landed on cells the map marks free and clear of obstacles${where}.`,
    };
  });
}
