import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { findSustainedRuns, medianInPlace } from '../../../../shared/engine/flags/intervals';

const times = (n: number) => Float64Array.from({ length: n }, (_, k) => k / 10);
const mask = (n: number, on: number[]) => {
  const m = new Uint8Array(n);
  for (const k of on) m[k] = 1;
  return m;
};

describe('findSustainedRuns', () => {
  it('merges runs separated by at most the gap and drops short blips (common practice)', () => {
    const t = times(100);
    const on = [10, 11, 12, 13, 14, 17, 18, 19, 20, 50, 70, 71];
    const runs = findSustainedRuns(t, mask(100, on), 0.5, 0.3);
    // 10..14 and 17..20 are 0.3 s apart: one run of 1.0 s; 50 and 70..71 last under 0.5 s.
    expect(runs).toEqual([{ first: 10, last: 20 }]);
  });

  it('keeps runs apart when the gap is wider than allowed', () => {
    const t = times(100);
    const runs = findSustainedRuns(t, mask(100, [10, 11, 12, 13, 14, 15, 30, 31, 32, 33, 34, 35]), 0.5, 0.3);
    expect(runs).toEqual([
      { first: 10, last: 15 },
      { first: 30, last: 35 },
    ]);
  });
});

/** jstat's median; the project's jstat type declaration only lists the distributions. */
const referenceMedian = (jStat as unknown as { median(values: number[]): number }).median;

describe('medianInPlace', () => {
  it('agrees with jstat.median on odd and even lengths, with ties', () => {
    // jStat.median is the reference statistics library's median.
    let state = 12345;
    // Park-Miller minimal standard generator: enough to make varied test inputs.
    const next = () => {
      state = (state * 48271) % 2147483647;
      return state / 2147483647;
    };
    for (const n of [1, 2, 3, 10, 51, 100, 257]) {
      const values = Float64Array.from({ length: n }, next);
      for (let k = 0; k < n; k += 7) values[k] = Math.round(values[k] * 4) / 4;
      const expected = referenceMedian(Array.from(values));
      expect(medianInPlace(values.slice(), n)).toBeCloseTo(expected, 12);
    }
  });

  it('is NaN for no values', () => {
    expect(medianInPlace(new Float64Array(0), 0)).toBeNaN();
  });
});
