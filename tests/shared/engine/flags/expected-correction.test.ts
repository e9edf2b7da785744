/**
 * The expected odometry error over a window, checked against the odometry motion model's
 * variances worked by hand (Thrun, Burgard, Fox, Probabilistic Robotics, 2005, Table 5.6:
 * var(rot1) = a1 rot1^2 + a2 trans^2, var(trans) = a3 trans^2 + a4 (rot1^2 + rot2^2),
 * var(rot2) = a1 rot2^2 + a2 trans^2; alphas are variance coefficients).
 */
import { describe, expect, it } from 'vitest';
import { measureExpectedCorrection } from '../../../../shared/engine/flags/expected-correction';

const ALPHA = [0.05, 0.005, 0.01, 0.002] as const;

/** 21 steps at 10 Hz; odometry from `move(k)` cumulative poses. */
function table(pose: (k: number) => [number, number, number]) {
  const n = 21;
  const t = new Float64Array(n);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const theta = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    t[k] = k / 10;
    [x[k], y[k], theta[k]] = pose(k);
  }
  return { t, odometry: { t, x, y, theta } };
}

describe('measureExpectedCorrection', () => {
  it('a turn on the spot at 1 rad/s: heading spread sqrt(10 x a1 x 0.1^2) = 0.0707 rad per 1 s', () => {
    const { t, odometry } = table((k) => [0, 0, 0.1 * k]);
    const expected = measureExpectedCorrection(t, odometry, ALPHA, 1);
    // trans = 0, rot1 = 0 (no travel), rot2 = 0.1: var(rot2) = 0.05 x 0.01 = 5e-4 per step, 10 steps in (t - 1, t].
    expect(expected.heading[20]).toBeCloseTo(Math.sqrt(10 * 5e-4), 6);
    // var(trans) = a4 x 0.1^2 = 2e-5 per step.
    expect(expected.position[20]).toBeCloseTo(Math.sqrt(10 * 2e-5), 6);
  });

  it('a straight run at 0.8 m/s: heading spread sqrt(10 x 2 x a2 x 0.08^2) = 0.0253 rad per 1 s', () => {
    const { t, odometry } = table((k) => [0.08 * k, 0, 0]);
    const expected = measureExpectedCorrection(t, odometry, ALPHA, 1);
    // var(rot1) = var(rot2) = 0.005 x 0.0064 = 3.2e-5 per step.
    expect(expected.heading[20]).toBeCloseTo(Math.sqrt(10 * 6.4e-5), 6);
    // var(trans) = 0.01 x 0.0064 = 6.4e-5, plus trans^2 var(rot1) = 0.0064 x 3.2e-5 across the track.
    expect(expected.position[20]).toBeCloseTo(Math.sqrt(10 * (6.4e-5 + 0.0064 * 3.2e-5)), 6);
  });

  it('expects a tight turn to need a larger heading correction than a straight run', () => {
    const spin = table((k) => [0, 0, 0.1 * k]);
    const line = table((k) => [0.08 * k, 0, 0]);
    const turn = measureExpectedCorrection(spin.t, spin.odometry, ALPHA, 1);
    const straight = measureExpectedCorrection(line.t, line.odometry, ALPHA, 1);
    expect(turn.heading[20]).toBeGreaterThan(2 * straight.heading[20]);
  });
});
