import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  chiSquareQuantile,
  logSumExp,
  normalDensity,
  normalLogDensity,
  normalQuantile,
  wrapAngle,
} from '../../../shared/engine/stats';

describe('normal density', () => {
  it.each([
    [0, 0, 1],
    [1.5, 0.2, 0.1],
    [-3, 1, 2.5],
    [0.04, 0, 0.1],
  ])('agrees with jstat normal.pdf at x=%f, mean=%f, sigma=%f', (x, mean, sigma) => {
    // Reference: jstat (npm) normal.pdf.
    expect(normalDensity(x, mean, sigma)).toBeCloseTo(jStat.normal.pdf(x, mean, sigma), 12);
    expect(normalLogDensity(x, mean, sigma)).toBeCloseTo(Math.log(jStat.normal.pdf(x, mean, sigma)), 10);
  });
});

describe('chi-square quantiles', () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods, section 1.3.6.7.4, upper critical values of
  // the chi-square distribution: dof 2: 5.991 (0.95), 9.210 (0.99); dof 3: 7.815 (0.95), 11.345 (0.99).
  it.each([
    [0.95, 2, 5.991],
    [0.99, 2, 9.21],
    [0.95, 3, 7.815],
    [0.99, 3, 11.345],
  ])('p=%f dof=%i gives the handbook value %f', (p, dof, table) => {
    expect(Math.abs(chiSquareQuantile(p, dof) - table)).toBeLessThan(0.0006);
  });

  it.each([
    [0.5, 2],
    [0.9, 3],
    [0.999, 3],
    [0.95, 6],
  ])('agrees with jstat chisquare.inv at p=%f dof=%i', (p, dof) => {
    const reference = jStat.chisquare.inv(p, dof);
    // Exact branches (dof 2, 3) to 1e-6 relative; Wilson–Hilferty (other dof) to 0.5 %.
    const tolerance = dof <= 3 ? 1e-6 : 5e-3;
    expect(Math.abs(chiSquareQuantile(p, dof) - reference) / reference).toBeLessThan(tolerance);
  });
});

describe('normal quantile', () => {
  it.each([0.001, 0.025, 0.3, 0.5, 0.9, 0.99, 0.9999])('agrees with jstat normal.inv at p=%f', (p) => {
    expect(normalQuantile(p)).toBeCloseTo(jStat.normal.inv(p, 0, 1), 6);
  });
});

describe('log-sum-exp and angles', () => {
  it('equals the naive sum where that is representable and stays finite where it is not', () => {
    const values = Float64Array.from([-1, 0.5, 2, -3]);
    expect(logSumExp(values)).toBeCloseTo(Math.log(values.reduce((s, v) => s + Math.exp(v), 0)), 12);
    const shifted = values.map((v) => v - 2000);
    expect(logSumExp(shifted)).toBeCloseTo(logSumExp(values) - 2000, 9);
  });

  it('wraps to (-pi, pi]', () => {
    expect(wrapAngle(Math.PI)).toBe(Math.PI);
    expect(wrapAngle(-Math.PI)).toBe(Math.PI);
    expect(wrapAngle((3 * Math.PI) / 2)).toBeCloseTo(-Math.PI / 2, 12);
    expect(wrapAngle(-7)).toBeCloseTo(-7 + 2 * Math.PI, 12);
  });
});
