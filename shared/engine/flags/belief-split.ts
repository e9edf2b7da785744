/**
 * belief_split: the particles formed several separate clusters for a while, i.e. the scans fit
 * more than one place (symmetric aisles) and the replay could not decide.
 */
import type { ReplaySeries } from '../replay-series';
import type { ReplayFlag } from './flag-types';
import { countMarked, findSustainedRuns, fixed, rangeOver, runSeconds } from './intervals';

export const SPLIT_MIN_CLUSTERS = 2;
export const SPLIT_MIN_DURATION = 1;
export const SPLIT_MAX_GAP = 0.3;
/** Splits lasting this long (s) are critical: the replay's mean pose is meaningless meanwhile. */
export const SPLIT_CRITICAL_DURATION = 5;

export function detectBeliefSplit(series: ReplaySeries): ReplayFlag[] {
  const marked = new Uint8Array(series.t.length);
  for (let k = 0; k < marked.length; k++) if (series.clusters[k] >= SPLIT_MIN_CLUSTERS) marked[k] = 1;
  return findSustainedRuns(series.t, marked, SPLIT_MIN_DURATION, SPLIT_MAX_GAP).map((run) => {
    const seconds = runSeconds(series.t, run);
    const { max } = rangeOver(series.clusters, run);
    const steps = run.last - run.first + 1;
    return {
      kind: 'belief_split',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: seconds >= SPLIT_CRITICAL_DURATION ? 'critical' : 'warning',
      evidence: `The belief held ${SPLIT_MIN_CLUSTERS} or more separate clusters (up to ${max}) in ${countMarked(marked, run)} of ${steps} steps over ${fixed(seconds)} s.`,
    };
  });
}
