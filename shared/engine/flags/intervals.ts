/**
 * Turning per-step conditions into flag intervals: runs of flagged steps, bridged across short
 * gaps, with blips shorter than a minimum duration dropped.
 */

/** Slack (s) on time comparisons, so 1.7 - 1.4 counts as the 0.3 s it is meant to be. */
const TIME_TOLERANCE = 1e-9;

/** Inclusive step range [first, last]. */
export interface StepRun {
  first: number;
  last: number;
}

/**
 * Runs of steps where `mask[k]` is non-zero (times `t`, s). Runs separated by at most `maxGap`
 * seconds are merged; merged runs spanning less than `minDuration` seconds (t[last] - t[first])
 * are dropped.
 */
export function findSustainedRuns(
  t: Float64Array,
  mask: Uint8Array,
  minDuration: number,
  maxGap: number,
): StepRun[] {
  const runs: StepRun[] = [];
  let current: StepRun | undefined;
  for (let k = 0; k < mask.length; k++) {
    if (!mask[k]) continue;
    if (current && t[k] - t[current.last] <= maxGap + TIME_TOLERANCE) current.last = k;
    else {
      if (current) runs.push(current);
      current = { first: k, last: k };
    }
  }
  if (current) runs.push(current);
  return runs.filter((run) => t[run.last] - t[run.first] >= minDuration - TIME_TOLERANCE);
}

/** Number of steps inside `run` whose mask is set. */
export function countMarked(mask: Uint8Array, run: StepRun): number {
  let count = 0;
  for (let k = run.first; k <= run.last; k++) if (mask[k]) count++;
  return count;
}

/** Minimum and maximum of the finite values of `values` over `run` (NaN when none). */
export function rangeOver(values: ArrayLike<number>, run: StepRun): { min: number; max: number } {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let k = run.first; k <= run.last; k++) {
    const v = values[k];
    if (!Number.isFinite(v)) continue;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return min <= max ? { min, max } : { min: Number.NaN, max: Number.NaN };
}

/** The k-th smallest of values[0..count) by quickselect (Hoare partition); reorders the entries. */
function selectInPlace(values: Float64Array, count: number, k: number): number {
  let left = 0;
  let right = count - 1;
  while (left < right) {
    const pivot = values[(left + right) >> 1];
    let i = left;
    let j = right;
    while (i <= j) {
      while (values[i] < pivot) i++;
      while (values[j] > pivot) j--;
      if (i <= j) {
        const swap = values[i];
        values[i] = values[j];
        values[j] = swap;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return values[k];
  }
  return values[k];
}

/**
 * Median of the first `count` entries of `values` (reorders them); NaN when empty. Linear time,
 * since the detectors take a trailing median at every step.
 */
export function medianInPlace(values: Float64Array, count: number): number {
  if (count === 0) return Number.NaN;
  const middle = count >> 1;
  const upper = selectInPlace(values, count, middle);
  if (count % 2) return upper;
  // After selection every entry below `middle` is <= upper: the lower median is their maximum.
  let lower = values[0];
  for (let k = 1; k < middle; k++) if (values[k] > lower) lower = values[k];
  return 0.5 * (lower + upper);
}

/** Duration of a run in seconds. */
export function runSeconds(t: Float64Array, run: StepRun): number {
  return t[run.last] - t[run.first];
}

/** Formats a number with fixed decimals for evidence sentences. */
export function fixed(value: number, decimals = 1): string {
  return value.toFixed(decimals);
}
