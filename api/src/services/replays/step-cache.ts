import fs from 'node:fs';
import path from 'node:path';
import type { Bundle } from '../../../../shared/bundle/types';
import type { TReplayStepResponse } from '../../../../shared/contracts/replays';
import { nearestKeyframe, resumeFrom } from '../../../../shared/engine/filter';
import type { Keyframe } from '../../../../shared/engine/particle-state';
import { buildReplayContext, type ReplayContext } from '../../../../shared/engine/replay-context';
import type { ReplaySeries } from '../../../../shared/engine/replay-series';
import { RESAMPLING_METHOD_CODE } from '../../../../shared/engine/resampling';
import { scanEndpointsAt } from '../../../../shared/engine/scan-endpoints';
import { readKeyframes, readReplayResultFile } from '../../replays/replay-files';

interface StepSource {
  context: ReplayContext;
  keyframes: Keyframe[];
  series: ReplaySeries;
}

const METHOD_BY_CODE = Object.fromEntries(
  Object.entries(RESAMPLING_METHOD_CODE).map(([name, code]) => [code, name]),
);

/** Small least-recently-used map: parsed bundles and replay contexts are large. */
function createLru<V>(capacity: number) {
  const entries = new Map<string, V>();
  return {
    get(key: string): V | undefined {
      const value = entries.get(key);
      if (value !== undefined) {
        entries.delete(key);
        entries.set(key, value);
      }
      return value;
    },
    set(key: string, value: V) {
      entries.delete(key);
      entries.set(key, value);
      while (entries.size > capacity) entries.delete(entries.keys().next().value as string);
    },
    /** Removes the entry only if it still holds this value (a newer one may have replaced it). */
    deleteIf(key: string, value: V) {
      if (entries.get(key) === value) entries.delete(key);
    },
  };
}

function toTypedSeries(columns: Record<string, (number | null)[]>): ReplaySeries {
  const series: Record<string, Float64Array> = {};
  for (const [name, values] of Object.entries(columns)) {
    series[name] = Float64Array.from(values, (v) => (v === null ? Number.NaN : v));
  }
  return series as unknown as ReplaySeries;
}

/**
 * Answers "the exact particle set after step k" by re-simulating from the nearest stored
 * keyframe. Built contexts are cached here and parsed bundles by the injected loader, so repeated
 * scrubbing stays fast.
 */
export function createStepCache(loadBundle: (bundleId: string) => Promise<Bundle>) {
  const sources = createLru<Promise<StepSource>>(4);

  async function buildSource(bundleId: string, dir: string): Promise<StepSource> {
    const result = readReplayResultFile(dir);
    const bundle = await loadBundle(bundleId);
    const columns = JSON.parse(await fs.promises.readFile(path.join(dir, 'series.json'), 'utf8'));
    return {
      context: buildReplayContext(bundle, result.settings),
      keyframes: readKeyframes(dir, result.keyframes),
      series: toTypedSeries(columns),
    };
  }

  function sourceFor(replayId: string, bundleId: string, dir: string): Promise<StepSource> {
    let pending = sources.get(replayId);
    if (!pending) {
      const built = buildSource(bundleId, dir);
      // A failed load (files removed mid-read and since rebuilt, a bundle briefly unreadable) must
      // not be remembered: the next request loads again instead of failing for good.
      built.catch(() => sources.deleteIf(replayId, built));
      sources.set(replayId, built);
      pending = built;
    }
    return pending;
  }

  async function stepAt(
    replayId: string,
    bundleId: string,
    dir: string,
    step: number,
  ): Promise<TReplayStepResponse> {
    const { context, keyframes, series } = await sourceFor(replayId, bundleId, dir);
    const state = resumeFrom(context, nearestKeyframe(keyframes, step), step);
    const weight = new Array<number>(state.count);
    for (let i = 0; i < state.count; i++) weight[i] = Math.exp(state.logWeight[i]);
    const methodCode = series.resampled[step];
    return {
      step,
      t: series.t[step],
      count: state.count,
      x: Array.from(state.x.subarray(0, state.count)),
      y: Array.from(state.y.subarray(0, state.count)),
      theta: Array.from(state.theta.subarray(0, state.count)),
      weight,
      resampled: methodCode > 0,
      method: methodCode > 0 ? (METHOD_BY_CODE[methodCode] ?? null) : null,
      mean: { x: series.x[step], y: series.y[step], theta: series.theta[step] },
      covariance: {
        xx: series.cov_xx[step],
        xy: series.cov_xy[step],
        yy: series.cov_yy[step],
        tt: series.cov_tt[step],
      },
      scanEndpoints: Array.from(scanEndpointsAt(context, series, step)),
    };
  }

  /** Loads a replay's inputs ahead of the first scrub. */
  function warm(replayId: string, bundleId: string, dir: string): void {
    sourceFor(replayId, bundleId, dir).catch(() => undefined);
  }

  return { stepAt, warm };
}

export type StepCache = ReturnType<typeof createStepCache>;
