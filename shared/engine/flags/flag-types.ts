/**
 * Investigator flags: intervals of a replay worth a closer look. Structurally identical to
 * `ZReplayFlag` in shared/contracts/replays.ts (kept separate so the engine does not depend on zod).
 */
import type { Bundle } from '../../bundle/types';
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import type { ReplaySettings } from '../settings';

export type FlagSeverity = 'info' | 'warning' | 'critical';

/** Every kind a detector can raise (docs/flags.md); each has a label in shared/human-labels.ts. */
export const FLAG_KINDS = [
  'belief_collapsed',
  'belief_split',
  'input_gap',
  'map_out_of_date',
  'moving_obstacle',
  'odometry_disagrees_with_scans',
  'odometry_jump',
  'onboard_departed_from_reference',
  'onboard_departed_from_replay',
  'replay_lost_reference',
  'sensor_evidence_dropped',
] as const;
export type FlagKind = (typeof FLAG_KINDS)[number];

export interface ReplayFlag {
  /** snake_case kind, see docs/flags.md */
  kind: FlagKind;
  /** s since the bundle's start_time */
  start: number;
  end: number;
  severity: FlagSeverity;
  /** One sentence with the numbers behind the flag. */
  evidence: string;
  /** For a flag gathered from several intervals (an unmapped object seen on many passes): each of them, in time order. */
  sightings?: FlagSighting[];
  /** Where the flagged thing is (map frame, m), when the flag is about a place. */
  location?: { x: number; y: number };
  /** Its size across (m), when known. */
  size?: number;
}

/** One interval (s since start_time) of a gathered flag. */
export interface FlagSighting {
  start: number;
  end: number;
}

/** What the detectors read: the finished replay and the bundle it came from. */
export interface FlagInput {
  bundle: Bundle;
  series: ReplaySeries;
  settings: ReplaySettings;
  /** 95 % chi-square bound for `series.nees_onboard`. */
  neesBound: number;
  /** Needed by the scan-based detectors; built from bundle + settings when absent. */
  context?: ReplayContext;
}
