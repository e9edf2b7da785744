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
