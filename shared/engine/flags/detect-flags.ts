/**
 * Runs every flag detector over a finished replay and returns the flags sorted by start time.
 * Pure and deterministic; thresholds and rules are documented in docs/flags.md.
 */
import { DIVERGENCE_DISTANCE, DIVERGENCE_HOLD, findDivergenceTime } from '../divergence';
import { buildReplayContext } from '../replay-context';
import { detectBeliefCollapse } from './belief-collapse';
import { detectBeliefSplit } from './belief-split';
import { measureEvidenceProfile } from './evidence-profile';
import type { FlagInput, ReplayFlag } from './flag-types';
import { detectInputStreamProblems } from './input-stream-gaps';
import { fixed, rangeOver } from './intervals';
import { countFreeSpaceEndpoints, detectMapOutOfDate } from './map-out-of-date';
import { detectOdometryScanDisagreement } from './odometry-scan-disagreement';
import { detectOnboardDepartureFromReference, detectOnboardDepartureFromReplay } from './onboard-departure';
import { detectSensorEvidenceDrop } from './sensor-evidence-drop';

const SEVERITY_ORDER = { critical: 0, warning: 1, info: 2 } as const;

/** replay_lost_reference: the replay stayed more than DIVERGENCE_DISTANCE from the reference (see divergence.ts). */
function detectReplayDivergence(input: FlagInput): ReplayFlag[] {
  const { t, error_reference: error } = input.series;
  const start = findDivergenceTime(t, error);
  if (start === null) return [];
  let first = 0;
  while (t[first] < start) first++;
  let last = first;
  while (last + 1 < t.length && error[last + 1] > DIVERGENCE_DISTANCE) last++;
  const { max } = rangeOver(error, { first, last });
  return [
    {
      kind: 'replay_lost_reference',
      start,
      end: t[last],
      severity: 'critical',
      evidence: `The replay stayed more than ${DIVERGENCE_DISTANCE} m from the reference trajectory for ${fixed(t[last] - start)} s (at least ${DIVERGENCE_HOLD} s needed; max ${fixed(max, 2)} m).`,
    },
  ];
}

/** All flags of a replay, sorted by start time (then severity, then kind). */
export function detectFlags(input: FlagInput): ReplayFlag[] {
  const { bundle, series, settings } = input;
  const usesScans = Boolean(bundle.scans && bundle.map.grid && bundle.manifest.scan && settings.scan_model);
  const context = input.context ?? (usesScans ? buildReplayContext(bundle, settings) : undefined);
  const profile = measureEvidenceProfile(series);
  const counts = context ? countFreeSpaceEndpoints(context, series) : undefined;
  const flags = [
    ...detectBeliefCollapse(series, settings.particles, counts),
    ...detectSensorEvidenceDrop(series, profile, counts),
    ...detectOdometryScanDisagreement(series, profile, context, counts),
    ...(counts ? detectMapOutOfDate(series, counts, context) : []),
    ...detectOnboardDepartureFromReplay(series, input.neesBound),
    ...detectOnboardDepartureFromReference(bundle),
    ...detectBeliefSplit(series),
    ...detectInputStreamProblems(bundle),
    ...detectReplayDivergence(input),
  ];
  return flags.sort(
    (a, b) =>
      a.start - b.start ||
      SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity] ||
      (a.kind < b.kind ? -1 : a.kind > b.kind ? 1 : 0),
  );
}
