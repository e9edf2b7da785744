import { z } from 'zod';
import { CAUSE_KINDS } from '../engine/causes/cause-types';
import { ZReplayOverrides } from '../engine/settings';
import type { SafetyReport } from '../safety/safety-report';
import { safeText } from './safe-text';

export { ZReplayOverrides };

export const REPLAY_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type TReplayStatus = (typeof REPLAY_STATUSES)[number];

/** Statuses of a replay that has not ended yet. */
export const LIVE_REPLAY_STATUSES = ['queued', 'running'] as const satisfies readonly TReplayStatus[];
export const isReplayLive = (status: TReplayStatus | undefined): boolean =>
  status === 'queued' || status === 'running';

/** Body of `POST /api/bundles/:id/replays`: no overrides replays with the manifest's settings. */
export const ZStartReplayRequest = z.strictObject({
  label: safeText().trim().max(120).optional(),
  overrides: ZReplayOverrides.optional().default({}),
});
export type TStartReplayRequest = z.input<typeof ZStartReplayRequest>;

export const ZReplayFlag = z.object({
  kind: z.string(),
  /** s since the bundle's start_time */
  start: z.number(),
  end: z.number(),
  severity: z.enum(['info', 'warning', 'critical']),
  evidence: z.string(),
  /** A flag gathered from several intervals (one unmapped object seen on many passes): each interval. */
  sightings: z.array(z.object({ start: z.number(), end: z.number() })).optional(),
  /** Map-frame place (m) of what the flag is about, and its size across (m), when known. */
  location: z.object({ x: z.number(), y: z.number() }).optional(),
  size: z.number().optional(),
});
export type TReplayFlag = z.infer<typeof ZReplayFlag>;

/** One counterfactual replay behind a probable cause (docs/causes.md); `settings` re-run it. */
export const ZCauseCounterfactual = z.object({
  label: z.string(),
  settings: z.record(z.string(), z.unknown()),
  digest: z.string(),
  metric: z.string(),
  /** null where the metric could not be measured (written from NaN). */
  value: z.number().nullable(),
  supports: z.boolean(),
});

/** A probable cause of what went wrong in a replay (docs/causes.md); structurally the engine's ProbableCause. */
export const ZProbableCause = z.object({
  kind: z.enum(CAUSE_KINDS),
  /** s since the bundle's start_time */
  start: z.number(),
  end: z.number(),
  /** [0, 1]; below 0.5 unless a counterfactual supports it */
  confidence: z.number(),
  evidence: z.string(),
  against: z.string(),
  counterfactuals: z.array(ZCauseCounterfactual),
});
export type TProbableCause = z.infer<typeof ZProbableCause>;

export const ZReplayMetrics = z.object({
  rmse_reference: z.number().nullable(),
  rmse_onboard: z.number().nullable(),
  /** First step time (s) from which the replay stayed more than the divergence distance from the reference; null if never. */
  diverged_at: z.number().nullable().optional(),
});

export const ZReplay = z.object({
  id: z.string(),
  bundleId: z.string(),
  caseId: z.string(),
  label: z.string(),
  status: z.enum(REPLAY_STATUSES),
  overrides: ZReplayOverrides,
  /** Effective settings (manifest filter block + overrides); null until the run starts. */
  settings: z.record(z.string(), z.unknown()).nullable(),
  digest: z.string().nullable(),
  /**
   * What produced the digest: engine version, digest layout (see shared/engine/engine-version.ts)
   * and runtime; null until done, and for replays made before engine 2.0.0 (digest layout 1).
   */
  engine: z.object({ engine: z.string(), digestLayout: z.number(), runtime: z.string() }).nullable(),
  steps: z.number().nullable(),
  elapsedMs: z.number().nullable(),
  metrics: ZReplayMetrics.nullable(),
  flags: z.array(ZReplayFlag),
  /**
   * Separation and stopping analysis (docs/safety-analysis.md): on `GET /api/replays/:id` of a
   * finished replay; null when the replay has none; absent from lists.
   */
  safety: z.custom<SafetyReport>().nullable().optional(),
  /**
   * Probable causes, highest confidence first (docs/causes.md): on `GET /api/replays/:id` of a
   * finished replay; null when the replay has none (made before causes existed); absent from lists.
   */
  causes: z.array(ZProbableCause).nullable().optional(),
  error: z.string().nullable(),
  progress: z.object({ step: z.number(), steps: z.number() }).nullable(),
  createdBy: z.object({ id: z.string(), name: z.string() }),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type TReplay = z.infer<typeof ZReplay>;

export const ZReplayList = z.object({ items: z.array(ZReplay) });
export type TReplayList = z.infer<typeof ZReplayList>;

/**
 * `GET /api/replays/:id/series`: one array per diagnostic, index = step; `null` where a value is
 * undefined (NaN), e.g. error_reference without a reference trajectory.
 */
export interface TReplaySeriesResponse {
  steps: number;
  /** 95 % chi-square bound for nees_onboard. */
  neesBound: number;
  /** Resampling threshold as a fraction of N, for the ESS track. */
  resamplingThreshold: number;
  columns: Record<string, (number | null)[]>;
}

/** `GET /api/replays/:id/steps/:k`: the exact particle set after step k, identical to the full run. */
export interface TReplayStepResponse {
  step: number;
  t: number;
  count: number;
  /** Map frame, m / rad; `weight` is normalised (sums to 1). */
  x: number[];
  y: number[];
  theta: number[];
  weight: number[];
  resampled: boolean;
  /** Resampling method used at this step, or null. */
  method: string | null;
  mean: { x: number; y: number; theta: number };
  covariance: { xx: number; xy: number; yy: number; tt: number };
  /** Map-frame endpoints [x0, y0, x1, y1, ...] of the step's scans placed at the weighted mean pose. */
  scanEndpoints: number[];
}
