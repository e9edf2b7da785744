import type { Bundle } from '../../../shared/bundle/types';
import type { TReplayFlag } from '../../../shared/contracts/replays';
import type { ReplayResult } from '../../../shared/engine/filter';

/**
 * Flags (intervals worth an investigator's attention) and the divergence time of a finished
 * replay. The detectors live in shared/engine/flags; this joins them to the job.
 */
export function analyseReplay(
  _bundle: Bundle,
  _result: ReplayResult,
): { flags: TReplayFlag[]; divergedAt: number | null } {
  // Wired to shared/engine/flags/detect-flags once the detectors land.
  return { flags: [], divergedAt: null };
}
