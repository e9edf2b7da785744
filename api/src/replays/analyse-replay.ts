import type { Bundle } from '../../../shared/bundle/types';
import type { TReplayFlag } from '../../../shared/contracts/replays';
import { findDivergenceTime } from '../../../shared/engine/divergence';
import type { ReplayResult } from '../../../shared/engine/filter';
import { detectFlags } from '../../../shared/engine/flags/detect-flags';
import type { ReplayContext } from '../../../shared/engine/replay-context';

/** Flags (intervals worth an investigator's attention) and the divergence time of a finished replay. */
export function analyseReplay(
  bundle: Bundle,
  result: ReplayResult,
  context?: ReplayContext,
): { flags: TReplayFlag[]; divergedAt: number | null } {
  const flags = detectFlags({
    bundle,
    series: result.series,
    settings: result.settings,
    neesBound: result.neesBound,
    context,
  });
  return { flags, divergedAt: findDivergenceTime(result.series.t, result.series.error_reference) };
}
