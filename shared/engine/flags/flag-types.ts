/**
 * Investigator flags: intervals of a replay worth a closer look. Structurally identical to
 * `ZReplayFlag` in shared/contracts/replays.ts (kept separate so the engine does not depend on zod).
 */
import type { Bundle } from '../../bundle/types';
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import type { ReplaySettings } from '../settings';

export type FlagSeverity = 'info' | 'warning' | 'critical';

export interface ReplayFlag {
  /** snake_case kind, see docs/flags.md */
  kind: string;
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
