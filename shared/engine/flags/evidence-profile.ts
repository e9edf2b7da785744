/**
 * Per-step sensor evidence against its recent level: the measurement log-likelihood per
 * measurement (nats) and the number of measurements, each compared with the median of the
 * preceding REFERENCE_WINDOW seconds of unflagged steps. Shared by the sensor-evidence and
 * odometry-disagreement detectors.
 */
import type { ReplaySeries } from '../replay-series';
import { medianInPlace } from './intervals';

/** Length (s) of the trailing window the recent level is taken from. */
export const REFERENCE_WINDOW = 10;
/** Fewer reference steps than this: no reference yet, nothing is flagged. */
export const MIN_REFERENCE_STEPS = 20;
/** A step drops out of the reference when its log-likelihood per measurement fell this much (nats). */
export const REFERENCE_EXCLUDE_DROP = 0.6;
/** ... or when its measurement count fell below this fraction of the recent level. */
export const REFERENCE_EXCLUDE_RATIO = 0.5;

export interface EvidenceProfile {
  /** Recent median minus this step's log-likelihood per measurement (nats); NaN without measurements or reference. */
  dropPerMeasurement: Float64Array;
  /** This step's measurement count over the recent median count; NaN without reference. */
  countRatio: Float64Array;
  /** Recent median log-likelihood per measurement (nats); NaN without reference. */
  referenceLevel: Float64Array;
  referenceCount: Float64Array;
}

/**
 * Builds the profile. Steps that dropped are kept out of the reference so a long fault is
 * compared with the level before it; once the reference window holds too few steps it is
 * re-seeded from the current level, so a lasting change ends the flag after at most one window.
 */
export function measureEvidenceProfile(series: ReplaySeries): EvidenceProfile {
  const steps = series.t.length;
  const profile: EvidenceProfile = {
    dropPerMeasurement: new Float64Array(steps).fill(Number.NaN),
    countRatio: new Float64Array(steps).fill(Number.NaN),
    referenceLevel: new Float64Array(steps).fill(Number.NaN),
    referenceCount: new Float64Array(steps).fill(Number.NaN),
  };
  // Accepted reference steps form a queue [head, tail) of step indices in time order.
  const accepted = new Int32Array(steps);
  let head = 0;
  let tail = 0;
  const scratch = new Float64Array(steps);
  const perMeasurement = new Float64Array(steps);
  for (let k = 0; k < steps; k++) perMeasurement[k] = series.log_likelihood[k] / series.measurements[k];
  for (let k = 0; k < steps; k++) {
    const measurements = series.measurements[k];
    const logLikelihood = series.log_likelihood[k];
    const hasValue = measurements > 0 && Number.isFinite(logLikelihood);
    while (head < tail && series.t[accepted[head]] < series.t[k] - REFERENCE_WINDOW) head++;
    const size = tail - head;
    let isDropped = false;
    if (size >= MIN_REFERENCE_STEPS) {
      for (let i = 0; i < size; i++) scratch[i] = perMeasurement[accepted[head + i]];
      const level = medianInPlace(scratch, size);
      for (let i = 0; i < size; i++) scratch[i] = series.measurements[accepted[head + i]];
      const count = medianInPlace(scratch, size);
      profile.referenceLevel[k] = level;
      profile.referenceCount[k] = count;
      profile.countRatio[k] = measurements / count;
      if (hasValue) profile.dropPerMeasurement[k] = level - perMeasurement[k];
      isDropped =
        !hasValue ||
        profile.dropPerMeasurement[k] >= REFERENCE_EXCLUDE_DROP ||
        profile.countRatio[k] < REFERENCE_EXCLUDE_RATIO;
    }
    if (hasValue && !isDropped) accepted[tail++] = k;
    else if (size > 0 && size < MIN_REFERENCE_STEPS / 2 && hasValue) {
      // The reference has nearly run dry during a long drop: start again from the current level.
      head = tail;
      accepted[tail++] = k;
    }
  }
  return profile;
}
