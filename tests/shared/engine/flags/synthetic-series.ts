/**
 * Hand-made replay series for detector tests: a steady, healthy-looking run at 10 Hz that a test
 * then bends into the pattern under test. Values follow the sample incidents' healthy levels
 * (about 58 measurements per step at about 1 nat each, ESS around half of 1000 particles).
 */
import { createReplaySeries, type ReplaySeries } from '../../../../shared/engine/replay-series';

export const RATE_HZ = 10;
export const PARTICLES = 1000;

/** Small deterministic wobble in [-1, 1] so no signal is perfectly flat. */
export function wobble(k: number): number {
  return Math.sin(k * 12.9898) * 0.5 + Math.sin(k * 4.1414) * 0.5;
}

export function makeHealthySeries(seconds: number): ReplaySeries {
  const steps = Math.round(seconds * RATE_HZ);
  const series = createReplaySeries(steps);
  for (let k = 0; k < steps; k++) {
    series.t[k] = k / RATE_HZ;
    series.x[k] = 0.1 * k;
    series.ess[k] = 500 + 200 * wobble(k);
    series.measurements[k] = 58 + Math.round(2 * wobble(k + 7));
    series.log_likelihood[k] = series.measurements[k] * (1 + 0.15 * wobble(k + 3));
    series.correction_x[k] = 0.003 * wobble(k + 11);
    series.correction_y[k] = 0.003 * wobble(k + 13);
    series.correction_theta[k] = 0.003 * wobble(k + 17);
    series.particles[k] = PARTICLES;
    series.distinct[k] = PARTICLES;
    series.clusters[k] = 1;
    series.error_reference[k] = 0.04 + 0.02 * wobble(k + 19);
    series.error_onboard[k] = 0.05 + 0.03 * wobble(k + 23);
    series.nees_onboard[k] = 3 + 2 * wobble(k + 29);
  }
  return series;
}

/** Step index of time `seconds`. */
export function stepAt(seconds: number): number {
  return Math.round(seconds * RATE_HZ);
}

/** Applies `change(k)` to every step in [from, to) seconds. */
export function forEachStep(from: number, to: number, change: (k: number) => void): void {
  for (let k = stepAt(from); k < stepAt(to); k++) change(k);
}
