/**
 * Per-step quantities every cause rule reads, computed once per replay with the flag code's own
 * helpers: endpoint counts at the mean pose, the evidence profile and the summed corrections.
 */
import { type EvidenceProfile, measureEvidenceProfile } from '../flags/evidence-profile';
import { countFreeSpaceEndpoints, type FreeSpaceEndpointCounts } from '../flags/map-out-of-date';
import { sumCorrections } from '../flags/odometry-scan-disagreement';
import type { CauseInput } from './cause-types';

export interface CauseEvidence {
  counts: FreeSpaceEndpointCounts;
  profile: EvidenceProfile;
  /** Trailing sums of the measurement corrections (rad, m) over DRIFT_WINDOW s. */
  drift: { heading: Float64Array; position: Float64Array };
}

export function measureCauseEvidence(input: CauseInput): CauseEvidence {
  const steps = input.series.t.length;
  const drift = { heading: new Float64Array(steps), position: new Float64Array(steps) };
  sumCorrections(input.series, drift);
  return {
    counts: countFreeSpaceEndpoints(input.context, input.series),
    profile: measureEvidenceProfile(input.series),
    drift,
  };
}
