import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { DETECTOR } from '../../../tools/simulator/format-bundle';
import { sampleReportedClass } from '../../../tools/simulator/landmark-detector';
import { RandomSource } from '../../../tools/simulator/random-source';

// jstat ships no type declarations; only its chi-square CDF is used here.
const jStat = createRequire(import.meta.url)('jstat') as {
  chisquare: { cdf(x: number, dof: number): number };
};

describe('sampleReportedClass', () => {
  // Pearson's chi-square goodness-of-fit test (common practice): with k categories the statistic
  // sum (observed - expected)² / expected follows chi-square with k - 1 degrees of freedom; the
  // p-value comes from the jstat reference implementation of the chi-square CDF.
  it.each([0, 1, 2])('reports classes with the frequencies of confusion row %i', (trueClass) => {
    const row = DETECTOR.confusion[trueClass];
    const draws = 60_000;
    const counts = new Array(row.length).fill(0);
    const random = new RandomSource(900 + trueClass);
    for (let i = 0; i < draws; i++) counts[sampleReportedClass(DETECTOR.confusion, trueClass, random)]++;
    let statistic = 0;
    row.forEach((p, j) => {
      const expected = p * draws;
      statistic += (counts[j] - expected) ** 2 / expected;
    });
    const pValue = 1 - jStat.chisquare.cdf(statistic, row.length - 1);
    expect(pValue).toBeGreaterThan(0.001);
  });

  it('is caught by the same test when the frequencies are wrong', () => {
    // The check must be able to fail: draws from a different row are rejected.
    const draws = 60_000;
    const counts = [0, 0, 0];
    const random = new RandomSource(77);
    for (let i = 0; i < draws; i++) counts[sampleReportedClass(DETECTOR.confusion, 1, random)]++;
    const row = DETECTOR.confusion[0];
    const statistic = row.reduce((sum, p, j) => sum + (counts[j] - p * draws) ** 2 / (p * draws), 0);
    expect(1 - jStat.chisquare.cdf(statistic, 2)).toBeLessThan(1e-6);
  });
});
