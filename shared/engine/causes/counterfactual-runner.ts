/**
 * Runs the counterfactual replays of one cause search: windows around an interval, started from
 * the original replay's belief there, each result kept so a window's unchanged baseline is run once.
 */
import { medianInPlace } from '../flags/intervals';
import type { ReplaySeries } from '../replay-series';
import type { ReplaySettings } from '../settings';
import type { CauseInput, CounterfactualSettings } from './cause-types';
import { replayCounterfactual } from './counterfactual-bundle';

/** Seconds of log kept before and after the interval a counterfactual is about. */
export const WINDOW_BEFORE = 3;
export const WINDOW_AFTER = 3;
/**
 * Longest span (s) a counterfactual replays: a long interval is judged on its start, where the
 * cause acts, and the cost of a cause search stays bounded on long logs.
 */
export const MAX_SPAN_SECONDS = 20;
/** Floors (m, rad) on the window's initial spread, so a starved particle set can still move. */
const MIN_SIGMA_XY = 0.05;
const MIN_SIGMA_THETA = 0.03;

export interface CounterfactualResult {
  digest: string;
  series: ReplaySeries;
}

/** First step at or after time `t` (s), or the last step. */
export function stepAt(series: ReplaySeries, t: number): number {
  let k = 0;
  while (k < series.t.length - 1 && series.t[k] < t) k++;
  return k;
}

/** Span [start - WINDOW_BEFORE, end + WINDOW_AFTER], at most MAX_SPAN_SECONDS long, clamped to the log. */
export function windowAround(series: ReplaySeries, start: number, end: number) {
  const last = series.t[series.t.length - 1];
  const first = Math.max(series.t[0], start - WINDOW_BEFORE);
  return { start: first, end: Math.min(last, end + WINDOW_AFTER, first + MAX_SPAN_SECONDS) };
}

/**
 * Settings for a window: `changes` applied to the replay's own settings, starting from its mean
 * pose and spread at the window's first step (or `pose` when the counterfactual re-initialises).
 */
export function windowSettings(
  input: CauseInput,
  span: { start: number; end: number },
  changes: Partial<ReplaySettings> = {},
  pose?: { x: number; y: number; theta: number },
): CounterfactualSettings {
  const { series } = input;
  const k = stepAt(series, span.start);
  const spread = Math.sqrt(Math.max(series.cov_xx[k], series.cov_yy[k], 0));
  return {
    span: { start: series.t[k], end: span.end },
    replay: {
      ...input.settings,
      ...changes,
      initial: {
        mode: 'pose',
        x: pose?.x ?? series.x[k],
        y: pose?.y ?? series.y[k],
        theta: pose?.theta ?? series.theta[k],
        sigma_xy: Math.max(MIN_SIGMA_XY, spread),
        sigma_theta: Math.max(MIN_SIGMA_THETA, Math.sqrt(Math.max(0, series.cov_tt[k]))),
      },
    },
  };
}

/** Replays one counterfactual (memoised by createCounterfactualRunner). */
export type RunCounterfactual = (settings: CounterfactualSettings) => CounterfactualResult;

/** A memoising runner: the same settings are replayed once. */
export function createCounterfactualRunner(input: CauseInput): RunCounterfactual {
  const done = new Map<string, CounterfactualResult>();
  return (settings: CounterfactualSettings): CounterfactualResult => {
    const key = JSON.stringify(settings);
    let result = done.get(key);
    if (!result) {
      const replay = replayCounterfactual(input.bundle, settings);
      result = { digest: replay.digest, series: replay.series };
      done.set(key, result);
    }
    return result;
  };
}

/** Median log-likelihood per measurement (nats) over the steps in [from, to]; NaN when none has one. */
export function medianEvidence(series: ReplaySeries, from: number, to: number): number {
  const values = new Float64Array(series.t.length);
  let count = 0;
  for (let k = 0; k < series.t.length; k++) {
    if (series.t[k] < from || series.t[k] > to) continue;
    const perMeasurement = series.log_likelihood[k] / series.measurements[k];
    if (series.measurements[k] > 0 && Number.isFinite(perMeasurement)) values[count++] = perMeasurement;
  }
  return medianInPlace(values, count);
}

/** Mean effective sample size as a share of the particle count over the steps in [from, to]; NaN when none. */
export function meanEssShare(series: ReplaySeries, from: number, to: number): number {
  let sum = 0;
  let count = 0;
  for (let k = 0; k < series.t.length; k++) {
    if (series.t[k] < from || series.t[k] > to || series.particles[k] <= 0) continue;
    sum += series.ess[k] / series.particles[k];
    count++;
  }
  return count > 0 ? sum / count : Number.NaN;
}

/**
 * Runs `edited` and the unchanged replay over the same window, and returns how much better the
 * scans fit in the edited one over [from, to] (median log-likelihood per measurement, nats).
 */
export function compareEvidence(
  input: CauseInput,
  run: RunCounterfactual,
  edited: CounterfactualSettings,
  from: number,
  to: number,
): { gain: number; digest: string; series: ReplaySeries; baseline: ReplaySeries } {
  const changed = run(edited);
  const baseline = run(windowSettings(input, edited.span)).series;
  return {
    gain: medianEvidence(changed.series, from, to) - medianEvidence(baseline, from, to),
    digest: changed.digest,
    series: changed.series,
    baseline,
  };
}
