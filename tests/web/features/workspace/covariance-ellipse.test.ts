import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  CHI2_2DOF_95,
  confidenceEllipse,
} from '../../../../web/src/features/workspace/lib/covariance-ellipse';

describe('95 % covariance ellipse', () => {
  it('uses the chi-square 2-dof 0.95 quantile that jstat gives (5.991)', () => {
    // Reference: jstat chisquare.inv (npm); NIST/SEMATECH e-Handbook, Table 1.3.6.7.4: 5.991.
    expect(CHI2_2DOF_95).toBeCloseTo(jStat.chisquare.inv(0.95, 2), 6);
    expect(CHI2_2DOF_95).toBeCloseTo(5.991, 3);
  });

  it('has semi-axes sqrt(lambda * q) along the eigenvectors', () => {
    // [[2,1],[1,2]] has eigenvalues 3 and 1 with eigenvectors along +45 and -45 degrees
    // (worked example, Strang, Introduction to Linear Algebra, 5th ed., section 6.1).
    const ellipse = confidenceEllipse(2, 1, 2)!;
    expect(ellipse.major).toBeCloseTo(Math.sqrt(3 * CHI2_2DOF_95), 9);
    expect(ellipse.minor).toBeCloseTo(Math.sqrt(1 * CHI2_2DOF_95), 9);
    expect(ellipse.angle).toBeCloseTo(Math.PI / 4, 9);
  });

  it('keeps its axes when the covariance is rotated (a rotated Gaussian has the same spread)', () => {
    const rotation = 0.7;
    const [a, b] = [0.09, 0.01];
    const c = Math.cos(rotation);
    const s = Math.sin(rotation);
    const ellipse = confidenceEllipse(a * c * c + b * s * s, (a - b) * c * s, a * s * s + b * c * c)!;
    expect(ellipse.major).toBeCloseTo(Math.sqrt(a * CHI2_2DOF_95), 9);
    expect(ellipse.minor).toBeCloseTo(Math.sqrt(b * CHI2_2DOF_95), 9);
    expect(ellipse.angle).toBeCloseTo(rotation, 9);
  });

  it('refuses a matrix that is not a covariance', () => {
    expect(confidenceEllipse(Number.NaN, 0, 1)).toBeNull();
    expect(confidenceEllipse(1, 2, 1)).toBeNull();
  });
});
