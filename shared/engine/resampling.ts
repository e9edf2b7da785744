/**
 * Resampling schemes compared by Douc, Cappé & Moulines, "Comparison of resampling schemes for
 * particle filtering" (ISPA 2005): multinomial, stratified, systematic, residual.
 * Input: normalised weights; output: ancestor indices. Random draws come from the counter RNG keyed
 * (seed, resampling, step, output slot), so the result does not depend on threading.
 */
import type { ResamplingMethod } from '../bundle/types';
import { fillUniforms, type RandomScratch, RNG_PURPOSE } from './random';

/** Numeric codes of the methods, used in per-step diagnostics and the digest (0 = did not resample). */
export const RESAMPLING_METHOD_CODE: Record<ResamplingMethod, number> = {
  multinomial: 1,
  stratified: 2,
  systematic: 3,
  residual: 4,
};

/** Draw-block offsets keep each scheme's uniform streams apart within one step. */
const MULTINOMIAL_STREAM = 0;
const RESIDUAL_STREAM = 1;
const STRATIFIED_STREAM = 2;
const SYSTEMATIC_STREAM = 3;

/** Writes cumulative sums of weights[0..n) into `cumulative` and returns the total. */
function accumulate(weights: Float64Array, n: number, cumulative: Float64Array): number {
  let total = 0;
  for (let i = 0; i < n; i++) {
    total += weights[i];
    cumulative[i] = total;
  }
  return total;
}

/** Index of the first cumulative entry >= target (binary search), at most n - 1. */
function searchCumulative(cumulative: Float64Array, n: number, target: number): number {
  let low = 0;
  let high = n - 1;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (cumulative[middle] < target) low = middle + 1;
    else high = middle;
  }
  return low;
}

/** One uniform in (0, 1) for output slot `slot` of a stream; four slots share a Philox block. */
function slotUniform(
  seed: number,
  step: number,
  stream: number,
  slot: number,
  scratch: RandomScratch,
): number {
  fillUniforms(seed, RNG_PURPOSE.resampling, step, slot >>> 2, stream, scratch);
  return scratch.values[slot & 3];
}

function drawMultinomial(
  weights: Float64Array,
  n: number,
  draws: number,
  ancestors: Int32Array,
  offset: number,
  cumulative: Float64Array,
  seed: number,
  step: number,
  stream: number,
  scratch: RandomScratch,
): void {
  const total = accumulate(weights, n, cumulative);
  for (let j = 0; j < draws; j++) {
    ancestors[offset + j] = searchCumulative(
      cumulative,
      n,
      slotUniform(seed, step, stream, j, scratch) * total,
    );
  }
}

/** Ordered draws u_j in [0, 1) (already divided by M): a single pass over the cumulative sums. */
function drawOrdered(
  weights: Float64Array,
  n: number,
  draws: number,
  ancestors: Int32Array,
  cumulative: Float64Array,
  isSystematic: boolean,
  seed: number,
  step: number,
  scratch: RandomScratch,
): void {
  const total = accumulate(weights, n, cumulative);
  const shared = isSystematic ? slotUniform(seed, step, SYSTEMATIC_STREAM, 0, scratch) : 0;
  let i = 0;
  for (let j = 0; j < draws; j++) {
    const u = isSystematic ? shared : slotUniform(seed, step, STRATIFIED_STREAM, j, scratch);
    const target = ((j + u) / draws) * total;
    while (i < n - 1 && cumulative[i] < target) i++;
    ancestors[j] = i;
  }
}

/**
 * Fills ancestors[0..draws) by `method` from normalised `weights[0..n)`.
 * `cumulative` (length >= n) and `residualWeights` (length >= n) are scratch.
 */
export function resampleAncestors(
  method: ResamplingMethod,
  weights: Float64Array,
  n: number,
  draws: number,
  ancestors: Int32Array,
  seed: number,
  step: number,
  cumulative: Float64Array,
  residualWeights: Float64Array,
  scratch: RandomScratch,
): void {
  switch (method) {
    case 'multinomial':
      drawMultinomial(weights, n, draws, ancestors, 0, cumulative, seed, step, MULTINOMIAL_STREAM, scratch);
      return;
    case 'stratified':
      drawOrdered(weights, n, draws, ancestors, cumulative, false, seed, step, scratch);
      return;
    case 'systematic':
      drawOrdered(weights, n, draws, ancestors, cumulative, true, seed, step, scratch);
      return;
    case 'residual': {
      // Deterministic floor(M w_i) copies, then multinomial draws on the residual weights.
      let filled = 0;
      for (let i = 0; i < n; i++) {
        const expected = draws * weights[i];
        const copies = Math.floor(expected);
        for (let c = 0; c < copies && filled < draws; c++) ancestors[filled++] = i;
        residualWeights[i] = expected - copies;
      }
      const remaining = draws - filled;
      if (remaining > 0) {
        drawMultinomial(
          residualWeights,
          n,
          remaining,
          ancestors,
          filled,
          cumulative,
          seed,
          step,
          RESIDUAL_STREAM,
          scratch,
        );
      }
      return;
    }
  }
}

/** Counts how many different ancestors occur in ancestors[0..draws); `marks` (length >= n) is scratch, zeroed here. */
export function countDistinctAncestors(
  ancestors: Int32Array,
  draws: number,
  marks: Uint8Array,
  n: number,
): number {
  marks.fill(0, 0, n);
  let distinct = 0;
  for (let j = 0; j < draws; j++) {
    const a = ancestors[j];
    if (marks[a] === 0) {
      marks[a] = 1;
      distinct++;
    }
  }
  return distinct;
}
