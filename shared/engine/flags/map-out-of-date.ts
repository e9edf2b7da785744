/**
 * map_out_of_date: while most of each scan still fits the map (so the pose is right), a steady
 * share of endpoints lands on cells the map says are free and far from any obstacle: something
 * stands where the map has nothing (a moved rack, a parked pallet).
 */
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import { scanEndpointsAt } from '../scan-endpoints';
import { classifyEndpoint } from './endpoint-class';
import type { ReplayFlag } from './flag-types';
import { findSustainedRuns, fixed, runSeconds, type StepRun } from './intervals';
import { describeUnmappedObjects } from './unmapped-objects';

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
  if (!context.field || !context.bundle.map.grid || !context.settings.scan_model) return counts;
  for (let step = 0; step < steps; step++) {
    const endpoints = scanEndpointsAt(context, series, step);
    counts.total[step] = endpoints.length / 2;
    for (let e = 0; e < endpoints.length; e += 2) {
      const where = classifyEndpoint(context, endpoints[e], endpoints[e + 1]);
      if (where === 1) counts.fitting[step]++;
      else if (where === 2) {
        counts.free[step]++;
        counts.sumX[step] += endpoints[e];
        counts.sumY[step] += endpoints[e + 1];
      }
    }
  }
  return counts;
}

/** One interval of steps marked by the free-space rule, with its numbers. */
export interface FreeSpaceRun extends StepRun {
  /** Peak trailing share of free-space endpoints. */
  peak: number;
  /** Free and total endpoints summed over the run's usable steps, and the free ones' coordinate sums (m). */
  free: number;
  total: number;
  sumX: number;
  sumY: number;
  /** The old per-interval critical rule: peak >= MAP_CRITICAL_SHARE for at least MAP_CRITICAL_DURATION s. */
  isStrong: boolean;
}

/**
 * Flags scans that keep showing obstacles the map does not have. Without a context each marked
 * interval is one flag; with one (scans re-projected), intervals are sorted into unmapped objects
 * and passing movers (unmapped-objects.ts), so one object seen on many passes is one flag.
 */
export function detectMapOutOfDate(
  series: ReplaySeries,
  counts: FreeSpaceEndpointCounts,
  context?: ReplayContext,
): ReplayFlag[] {
  const { runs, usable } = findFreeSpaceRuns(series, counts);
  if (context) return describeUnmappedObjects(context, series, usable, runs);
  return runs.map((run) => {
    const seconds = runSeconds(series.t, run);
    const where =
      run.free > 0 ? `, centred near (${fixed(run.sumX / run.free)}, ${fixed(run.sumY / run.free)}) m` : '';
    return {
      kind: 'map_out_of_date',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: run.isStrong ? 'critical' : 'warning',
      evidence:
        `For ${fixed(seconds)} s ${fixed((100 * run.free) / Math.max(1, run.total), 0)} % of scan endpoints ` +
        `(peak ${fixed(run.peak * 100, 0)} % per ${MAP_WINDOW} s) landed on cells the map marks free and clear of obstacles${where}.`,
    };
  });
}

/** The free-space rule (docs/flags.md): marked intervals and which steps were usable. */
export function findFreeSpaceRuns(
  series: ReplaySeries,
  counts: FreeSpaceEndpointCounts,
): { runs: FreeSpaceRun[]; usable: Uint8Array } {
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
  const runs = findSustainedRuns(series.t, marked, MAP_MIN_DURATION, MAP_MAX_GAP).map((run): FreeSpaceRun => {
    const stats = { ...run, peak: 0, free: 0, total: 0, sumX: 0, sumY: 0, isStrong: false };
    for (let k = run.first; k <= run.last; k++) {
      stats.peak = Math.max(stats.peak, share[k]);
      if (!usable[k]) continue;
      stats.free += counts.free[k];
      stats.total += counts.total[k];
      stats.sumX += counts.sumX[k];
      stats.sumY += counts.sumY[k];
    }
    stats.isStrong = stats.peak >= MAP_CRITICAL_SHARE && runSeconds(series.t, run) >= MAP_CRITICAL_DURATION;
    return stats;
  });
  return { runs, usable };
}
