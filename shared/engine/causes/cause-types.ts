/**
 * Probable causes: why a replay went wrong, ranked, each tested by counterfactual replays.
 * Structurally identical to `ZProbableCause` in shared/contracts/replays.ts (kept separate so the
 * engine does not depend on zod). Rules and thresholds: docs/causes.md.
 */
import type { Bundle } from '../../bundle/types';
import type { ReplayFlag } from '../flags/flag-types';
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import type { ReplaySettings } from '../settings';

/** The fixed cause kinds (docs/causes.md). */
export const CAUSE_KINDS = [
  'odometry_fault',
  'external_displacement',
  'map_changed',
  'moving_obstacles',
  'sensor_degraded',
  'filter_settings',
  'none',
] as const;
export type CauseKind = (typeof CAUSE_KINDS)[number];

/** Kinds that are not a fault of the robot or its site data: reported, never "what went wrong". */
export const NON_FAULT_KINDS: readonly CauseKind[] = ['moving_obstacles', 'none'];

/**
 * How a counterfactual replay differs from the original, enough to re-run it with
 * `replayCounterfactual` (counterfactual-bundle.ts): the bundle cut to `span`, these edits, and
 * the replay settings in full.
 */
export interface CounterfactualSettings {
  /** Log time (s since start_time) the replay is cut to; it starts from the original replay's belief there. */
  span: { start: number; end: number };
  replay: ReplaySettings;
  /** Beam indices whose returns are removed from the scans between mask.start and mask.end. */
  masked_beams?: number[];
  /** Returns shorter than this (m) are removed between mask.start and mask.end. */
  masked_below?: number;
  mask?: { start: number; end: number };
  /** Odometry's travelled distance multiplied by this over the span (headings unchanged). */
  odometry_scale?: number;
  /** Map cells (map row order, row 0 northmost) marked occupied. */
  occupied_cells?: number[];
}

/** One counterfactual replay and the number it was judged on. */
export interface CounterfactualRun {
  /** What was changed, in plain words. */
  label: string;
  settings: CounterfactualSettings;
  /** Replay digest of the counterfactual (digest.ts). */
  digest: string;
  /** What `value` measures, with its unit. */
  metric: string;
  value: number;
  /** True when the outcome supports the cause (docs/causes.md gives each rule). */
  supports: boolean;
}

export interface ProbableCause {
  kind: CauseKind;
  /** s since the bundle's start_time */
  start: number;
  end: number;
  /** In [0, 1]; below 0.5 unless a counterfactual supports the cause. */
  confidence: number;
  /** One sentence with the numbers for the cause. */
  evidence: string;
  /** One sentence with the numbers against it ("" when nothing speaks against it). */
  against: string;
  counterfactuals: CounterfactualRun[];
}

/** A flag as the causes read it: by its kind's name (stored flags carry it as plain text). */
export type CauseFlag = Omit<ReplayFlag, 'kind'> & { kind: string };

/** What the cause finder reads: a finished replay, its bundle and its flags. */
export interface CauseInput {
  bundle: Bundle;
  series: ReplaySeries;
  settings: ReplaySettings;
  context: ReplayContext;
  flags: readonly CauseFlag[];
}
