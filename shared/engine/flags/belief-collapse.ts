/**
 * belief_collapsed: the weighted particle set repeatedly degenerates to a handful of particles.
 * Resampling resets the ESS, so a collapse shows as repeated very-low-ESS steps close together
 * rather than one long low stretch.
 */
import type { ReplaySeries } from '../replay-series';
import type { ReplayFlag } from './flag-types';
import { countMarked, findSustainedRuns, fixed, rangeOver, runSeconds } from './intervals';
import type { FreeSpaceEndpointCounts } from './map-out-of-date';
import { EXPLAINED_SCAN_SHARE, isScanExplained } from './scan-fit';

/** A step is low when ESS < this fraction of the particle count (healthy samples: 1-2 isolated steps). */
export const COLLAPSE_ESS_FRACTION = 0.02;
/** Low steps closer than this (s) belong to the same episode. */
export const COLLAPSE_MAX_GAP = 0.5;
/** Episodes need at least this many low steps. */
export const COLLAPSE_MIN_STEPS = 3;
/** Critical: at least this many low steps and minimum ESS below 1 % of N. */
export const COLLAPSE_CRITICAL_STEPS = 6;

/** Share of an episode's steps, or of the steps in the RECOVERY_WINDOW after it, whose scan must be explained (scan-fit.ts) for the episode to be context only. */
export const COLLAPSE_EXPLAINED_STEPS = 0.8;
/** s after an episode in which the scans fitting again shows the set recovered by itself. */
export const COLLAPSE_RECOVERY_WINDOW = 1;

/** Share of explained steps in [first, last]; NaN when the range is empty. */
function explainedShare(counts: FreeSpaceEndpointCounts | undefined, first: number, last: number): number {
  if (last < first) return Number.NaN;
  let explained = 0;
  for (let k = first; k <= last; k++) if (isScanExplained(counts, k)) explained++;
  return explained / (last - first + 1);
}

/**
 * Flags episodes of repeated belief collapse. `particles` is N before resampling (manifest count
 * without KLD). With endpoint counts, an episode during which the scans kept fitting the map at
 * the mean pose is `info`: the particle set thinned out (typically in a tight turn whose odometry
 * noise is larger than the motion model allows) but the robot was not lost.
 */
export function detectBeliefCollapse(
  series: ReplaySeries,
  particles: number,
  counts?: FreeSpaceEndpointCounts,
): ReplayFlag[] {
  const steps = series.t.length;
  const low = new Uint8Array(steps);
  const ratio = new Float64Array(steps);
  for (let k = 0; k < steps; k++) {
    // Step 0 weighs the initial belief for the first time; a collapse there is expected.
    const n = k > 0 ? series.particles[k - 1] : particles;
    ratio[k] = series.ess[k] / n;
    if (k > 0 && ratio[k] < COLLAPSE_ESS_FRACTION) low[k] = 1;
  }
  const flags: ReplayFlag[] = [];
  for (const run of findSustainedRuns(series.t, low, 0, COLLAPSE_MAX_GAP)) {
    const lowSteps = countMarked(low, run);
    if (lowSteps < COLLAPSE_MIN_STEPS) continue;
    const { min } = rangeOver(ratio, run);
    const minEss = rangeOver(series.ess, run).min;
    const critical = lowSteps >= COLLAPSE_CRITICAL_STEPS && min < COLLAPSE_ESS_FRACTION / 2;
    let after = run.last;
    while (after + 1 < steps && series.t[after + 1] <= series.t[run.last] + COLLAPSE_RECOVERY_WINDOW) after++;
    const during = explainedShare(counts, run.first, run.last);
    const recovered = explainedShare(counts, run.last + 1, after);
    const isContext =
      counts !== undefined && (during >= COLLAPSE_EXPLAINED_STEPS || recovered >= COLLAPSE_EXPLAINED_STEPS);
    const context = isContext
      ? ` The scans fit the map at the mean pose on ${fixed(during * 100, 0)} % of its steps and ${Number.isFinite(recovered) ? fixed(recovered * 100, 0) : '-'} % of the ${COLLAPSE_RECOVERY_WINDOW} s after it (at least ${fixed(EXPLAINED_SCAN_SHARE * 100, 0)} % of endpoints explained), so the robot was not lost: more particles or larger motion noise would keep the set healthy here.`
      : '';
    flags.push({
      kind: 'belief_collapsed',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: isContext ? 'info' : critical ? 'critical' : 'warning',
      evidence:
        `Effective sample size fell below ${fixed(COLLAPSE_ESS_FRACTION * 100, 0)} % of N in ${lowSteps} steps ` +
        `over ${fixed(runSeconds(series.t, run))} s (min ${fixed(minEss)} / ${particles}).${context}`,
    });
  }
  return flags;
}
