/**
 * belief_collapsed: the weighted particle set repeatedly degenerates to a handful of particles.
 * Resampling resets the ESS, so a collapse shows as repeated very-low-ESS steps close together
 * rather than one long low stretch.
 */
import type { ReplaySeries } from '../replay-series';
import type { ReplayFlag } from './flag-types';
import { countMarked, findSustainedRuns, fixed, rangeOver, runSeconds } from './intervals';

/** A step is low when ESS < this fraction of the particle count (healthy samples: 1-2 isolated steps). */
export const COLLAPSE_ESS_FRACTION = 0.02;
/** Low steps closer than this (s) belong to the same episode. */
export const COLLAPSE_MAX_GAP = 0.5;
/** Episodes need at least this many low steps. */
export const COLLAPSE_MIN_STEPS = 3;
/** Critical: at least this many low steps and minimum ESS below 1 % of N. */
export const COLLAPSE_CRITICAL_STEPS = 6;

/** Flags episodes of repeated belief collapse. `particles` is N before resampling (manifest count without KLD). */
export function detectBeliefCollapse(series: ReplaySeries, particles: number): ReplayFlag[] {
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
    flags.push({
      kind: 'belief_collapsed',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: critical ? 'critical' : 'warning',
      evidence:
        `Effective sample size fell below ${fixed(COLLAPSE_ESS_FRACTION * 100, 0)} % of N in ${lowSteps} steps ` +
        `over ${fixed(runSeconds(series.t, run))} s (min ${fixed(minEss)} / ${particles}).`,
    });
  }
  return flags;
}
