import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import type { ResamplingMethod } from '../../../shared/bundle/types';
import { createRandomScratch } from '../../../shared/engine/random';
import { resampleAncestors } from '../../../shared/engine/resampling';

const WEIGHTS = Float64Array.from([0.31, 0.005, 0.12, 0.0, 0.2, 0.055, 0.17, 0.14]);

function offspringCounts(
  method: ResamplingMethod,
  weights: Float64Array,
  draws: number,
  seed: number,
  step: number,
): number[] {
  const n = weights.length;
  const ancestors = new Int32Array(draws);
  resampleAncestors(
    method,
    weights,
    n,
    draws,
    ancestors,
    seed,
    step,
    new Float64Array(n),
    new Float64Array(n),
    createRandomScratch(),
  );
  const counts = new Array(n).fill(0);
  for (const a of ancestors) counts[a]++;
  return counts;
}

// Douc, Cappé & Moulines, "Comparison of resampling schemes for particle filtering" (ISPA 2005):
// all four schemes are unbiased (E[N_i] = N w_i); systematic gives floor(N w_i) or ceil(N w_i)
// copies; residual keeps at least floor(N w_i).
describe('resampling schemes', () => {
  it('systematic gives every particle floor(N w) or ceil(N w) copies, at many seeds', () => {
    for (let seed = 0; seed < 200; seed++) {
      const counts = offspringCounts('systematic', WEIGHTS, 50, seed, 1);
      counts.forEach((count, i) => {
        const expected = 50 * WEIGHTS[i];
        expect(count === Math.floor(expected) || count === Math.ceil(expected)).toBe(true);
      });
    }
  });

  it.each(['stratified', 'systematic', 'residual', 'multinomial'] as const)(
    '%s has expected counts N w_i averaged over seeds',
    (method) => {
      const runs = 2000;
      const draws = 40;
      const totals = new Array(WEIGHTS.length).fill(0);
      for (let run = 0; run < runs; run++) {
        const counts = offspringCounts(method, WEIGHTS, draws, 1000 + run, run);
        for (let i = 0; i < counts.length; i++) totals[i] += counts[i];
      }
      WEIGHTS.forEach((w, i) => {
        // Per-run variance is at most that of multinomial, N w (1 - w); 5 standard errors allowed.
        const standardError = Math.sqrt((draws * w * (1 - w)) / runs);
        expect(Math.abs(totals[i] / runs - draws * w)).toBeLessThanOrEqual(5 * standardError + 1e-12);
      });
    },
  );

  it('residual keeps at least floor(N w) copies of every particle', () => {
    for (let seed = 0; seed < 200; seed++) {
      const counts = offspringCounts('residual', WEIGHTS, 50, seed, 2);
      counts.forEach((count, i) => {
        expect(count).toBeGreaterThanOrEqual(Math.floor(50 * WEIGHTS[i]));
      });
      expect(counts.reduce((s, c) => s + c, 0)).toBe(50);
    }
  });

  it('multinomial counts pass a chi-square goodness-of-fit test at a fixed seed', () => {
    const weights = Float64Array.from([0.1, 0.2, 0.3, 0.25, 0.15]);
    const draws = 20_000;
    const counts = offspringCounts('multinomial', weights, draws, 2024, 7);
    let statistic = 0;
    weights.forEach((w, i) => {
      statistic += (counts[i] - draws * w) ** 2 / (draws * w);
    });
    // Pearson's chi-square test, dof = categories - 1 = 4; reference CDF from jstat.
    const pValue = 1 - jStat.chisquare.cdf(statistic, weights.length - 1);
    expect(pValue).toBeGreaterThan(0.01);
  });

  it('never picks a zero-weight particle', () => {
    for (const method of ['multinomial', 'stratified', 'systematic', 'residual'] as const) {
      for (let seed = 0; seed < 50; seed++) expect(offspringCounts(method, WEIGHTS, 64, seed, 0)[3]).toBe(0);
    }
  });
});
