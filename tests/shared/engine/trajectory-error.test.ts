import { describe, expect, it } from 'vitest';
import type { Bundle } from '../../../shared/bundle/types';
import { createReplaySeries } from '../../../shared/engine/replay-series';
import {
  computeTrajectoryErrors,
  NEES_BOUND_95,
  rootMeanSquare,
} from '../../../shared/engine/trajectory-error';

describe('trajectory errors', () => {
  const series = createReplaySeries(3);
  series.t.set([0.5, 1.5, 5]);
  series.x.set([1, 2, 3]);
  series.y.set([0, 0, 0]);
  series.theta.set([0, 0, 0]);
  const bundle = {
    reference: {
      t: Float64Array.of(0, 1, 2),
      x: Float64Array.of(0, 1, 2),
      y: Float64Array.of(0, 0, 2),
      theta: Float64Array.of(3, -3, 0),
      source: ['s', 's', 's'],
    },
    onboard: {
      t: Float64Array.of(0, 2),
      x: Float64Array.of(1.1, 1.1),
      y: Float64Array.of(0.2, 0.2),
      theta: Float64Array.of(0.1, 0.1),
      cov: {
        xx: Float64Array.of(0.01, 0.01),
        xy: Float64Array.of(0, 0),
        yy: Float64Array.of(0.04, 0.04),
        tt: Float64Array.of(0.01, 0.01),
      },
    },
  } as unknown as Bundle;
  computeTrajectoryErrors(series, bundle);

  it('interpolates linearly in time, headings along the shorter arc, NaN outside the span', () => {
    // t = 0.5: reference (0.5, 0), heading halfway from 3 to -3 across pi: pi.
    expect(series.error_reference[0]).toBeCloseTo(0.5, 12);
    expect(Math.abs(series.heading_error_reference[0])).toBeCloseTo(Math.PI, 9);
    // t = 1.5: reference (1.5, 1).
    expect(series.error_reference[1]).toBeCloseTo(Math.hypot(0.5, 1), 12);
    expect(series.error_reference[2]).toBeNaN();
    expect(rootMeanSquare(series.error_reference)).toBeCloseTo(Math.sqrt((0.25 + 1.25) / 2), 12);
  });

  it('computes the onboard NEES with the onboard covariance', () => {
    // e = (0.1, 0.2, 0.1): 0.1^2/0.01 + 0.2^2/0.04 + 0.1^2/0.01 = 3.
    expect(series.nees_onboard[0]).toBeCloseTo(3, 9);
    expect(series.error_onboard[0]).toBeCloseTo(Math.hypot(0.1, 0.2), 12);
    expect(series.nees_onboard[2]).toBeNaN();
    // NIST/SEMATECH e-Handbook chi-square table, dof 3 at 0.95: 7.815.
    expect(NEES_BOUND_95).toBeCloseTo(7.815, 3);
  });
});
