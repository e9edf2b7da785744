/**
 * sensor_evidence_dropped: the measurements fit the belief much worse than they did a moment ago
 * (log-likelihood per measurement fell), or far fewer valid measurements arrived (beams lost).
 */
import type { ReplaySeries } from '../replay-series';
import type { EvidenceProfile } from './evidence-profile';
import { REFERENCE_WINDOW } from './evidence-profile';
import type { ReplayFlag } from './flag-types';
import { findSustainedRuns, fixed, rangeOver, runSeconds } from './intervals';
import type { FreeSpaceEndpointCounts } from './map-out-of-date';
import { EXPLAINED_SCAN_SHARE, isScanExplained } from './scan-fit';

/** Drop in log-likelihood per measurement (nats) that marks a step (healthy samples peak near 0.45). */
export const EVIDENCE_DROP_NATS = 0.6;
/** Drop (median over the interval) that makes the flag critical. */
export const EVIDENCE_CRITICAL_DROP_NATS = 1.5;
/** Measurement count below this fraction of the recent level marks a step. */
export const EVIDENCE_COUNT_RATIO = 0.5;
/** Count ratio (minimum over the interval) that makes the flag critical. */
export const EVIDENCE_CRITICAL_COUNT_RATIO = 0.25;
/** Minimum interval duration (s) and largest bridged gap (s). */
export const EVIDENCE_MIN_DURATION = 0.3;
export const EVIDENCE_MAX_GAP = 0.5;

function medianOver(values: Float64Array, first: number, last: number): number {
  const finite: number[] = [];
  for (let k = first; k <= last; k++) if (Number.isFinite(values[k])) finite.push(values[k]);
  if (finite.length === 0) return Number.NaN;
  finite.sort((a, b) => a - b);
  const middle = finite.length >> 1;
  return finite.length % 2 ? finite[middle] : 0.5 * (finite[middle - 1] + finite[middle]);
}

/**
 * Flags evidence drops. With endpoint counts (scans and a map), a drop in log-likelihood on a step
 * whose scan is still explained by the map and unmapped objects (scan-fit.ts) is not marked: a
 * person beside the robot or a tight turn lowers the likelihood without anything being wrong with
 * the sensor. A loss of valid returns is always marked.
 */
export function detectSensorEvidenceDrop(
  series: ReplaySeries,
  profile: EvidenceProfile,
  counts?: FreeSpaceEndpointCounts,
): ReplayFlag[] {
  const steps = series.t.length;
  const marked = new Uint8Array(steps);
  for (let k = 0; k < steps; k++) {
    const isFitDrop = profile.dropPerMeasurement[k] >= EVIDENCE_DROP_NATS && !isScanExplained(counts, k);
    if (isFitDrop || profile.countRatio[k] < EVIDENCE_COUNT_RATIO) marked[k] = 1;
  }
  const flags: ReplayFlag[] = [];
  for (const run of findSustainedRuns(series.t, marked, EVIDENCE_MIN_DURATION, EVIDENCE_MAX_GAP)) {
    const drop = medianOver(profile.dropPerMeasurement, run.first, run.last);
    const ratio = rangeOver(profile.countRatio, run).min;
    const level = profile.referenceLevel[run.first];
    const count = profile.referenceCount[run.first];
    const isCountDrop = ratio < EVIDENCE_COUNT_RATIO;
    const critical =
      drop >= EVIDENCE_CRITICAL_DROP_NATS || (isCountDrop && ratio < EVIDENCE_CRITICAL_COUNT_RATIO);
    const seconds = fixed(runSeconds(series.t, run));
    const fit = Number.isFinite(drop)
      ? `the log-likelihood per measurement fell by a median ${fixed(drop, 2)} nats from its ${REFERENCE_WINDOW} s level of ${fixed(level, 2)}`
      : 'no usable measurements arrived';
    const beams = isCountDrop
      ? ` and valid measurements fell as low as ${fixed(ratio * 100, 0)} % of the recent ${fixed(count, 0)} per step`
      : '';
    flags.push({
      kind: 'sensor_evidence_dropped',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: critical ? 'critical' : 'warning',
      evidence: `For ${seconds} s ${fit}${beams}${counts ? ` (steps where at least ${fixed(EXPLAINED_SCAN_SHARE * 100, 0)} % of the scan still fit the map or an unmapped object are not counted)` : ''}.`,
    });
  }
  return flags;
}
