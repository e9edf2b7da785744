import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { countOccupiedBins, kldBound } from '../../../shared/engine/kld-sampling';

describe('KLD-sampling bound (Fox 2003)', () => {
  it.each([
    [2, 0.05, 0.01],
    [10, 0.05, 0.01],
    [50, 0.02, 0.05],
    [500, 0.1, 0.01],
  ])('k=%i, eps=%f, delta=%f matches the formula with jstat normal quantile', (k, epsilon, delta) => {
    // Fox, "Adapting the sample size in particle filters through KLD-sampling" (IJRR 2003), eq. 12:
    // n = (k-1)/(2 eps) * (1 - 2/(9(k-1)) + sqrt(2/(9(k-1))) z_{1-delta})^3; z from jstat normal.inv.
    const z = jStat.normal.inv(1 - delta, 0, 1);
    const a = 2 / (9 * (k - 1));
    const reference = ((k - 1) / (2 * epsilon)) * (1 - a + Math.sqrt(a) * z) ** 3;
    expect(kldBound(k, epsilon, delta)).toBe(Math.ceil(reference));
  });

  it('approaches the chi-square quantile / (2 eps) form: k=100, eps=0.05, delta=0.01', () => {
    // Same paper: n = chi2_{k-1, 1-delta} / (2 eps); the cube form is its Wilson–Hilferty approximation.
    const exact = jStat.chisquare.inv(0.99, 99) / 0.1;
    expect(Math.abs(kldBound(100, 0.05, 0.01) - exact) / exact).toBeLessThan(0.002);
  });

  it('counts occupied histogram bins', () => {
    const x = Float64Array.from([0.1, 0.2, 0.7, 0.1, -0.1]);
    const y = Float64Array.from([0.1, 0.3, 0.1, 0.1, 0.1]);
    const theta = Float64Array.from([0, 0, 0, 1, 0]);
    // Bins of 0.5 m, 0.5 m, 0.5 rad: (0,0,a), (1,0,a), (0,0,b), (-1,0,a).
    expect(countOccupiedBins(x, y, theta, null, 5, [0.5, 0.5, 0.5])).toBe(4);
    expect(countOccupiedBins(x, y, theta, Int32Array.from([0, 1, 1]), 3, [0.5, 0.5, 0.5])).toBe(1);
  });
});
