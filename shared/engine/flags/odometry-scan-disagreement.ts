/**
 * odometry_disagrees_with_scans: the scans say the robot moved differently from what odometry
 * reported (wheel slip, a push). Two signals:
 * - drift: the measurement updates keep correcting the odometry-predicted mean in the same
 *   direction (sum of corrections over a trailing window);
 * - offset: when the evidence dropped, a local scan match finds the scan fitting much better at a
 *   pose clearly away from the replay's mean pose (the filter could not follow the scans).
 *   Only steps where most of the scan no longer fits at the mean pose are matched: when most of
 *   it still fits, a better fit elsewhere is more likely a changed map (map_out_of_date).
 */
import { hypot } from '../numerics';
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import type { EvidenceProfile } from './evidence-profile';
import { type ExpectedCorrection, measureExpectedCorrection } from './expected-correction';
import type { ReplayFlag } from './flag-types';
import { findSustainedRuns, fixed, runSeconds, type StepRun } from './intervals';
import { type FreeSpaceEndpointCounts, MAP_MIN_FIT_SHARE } from './map-out-of-date';
import { createScanMatchWorkspace, findScanOffset } from './scan-match-offset';

/** Trailing window (s) over which corrections are summed. */
export const DRIFT_WINDOW = 1;
/** Summed heading correction (rad) over the window that marks a step (healthy samples: up to 0.07). */
export const DRIFT_HEADING = 0.12;
/** Summed position correction (m) over the window that marks a step (healthy samples: up to 0.14). */
export const DRIFT_POSITION = 0.3;
/**
 * A drift must also exceed this many standard deviations of the correction the motion model
 * expects over the window (expected-correction.ts), so ordinary turns, where the model itself
 * predicts large heading errors, are not taken for slips.
 */
export const DRIFT_EXPECTED_SIGMAS = 4;
/** Steps whose evidence dropped by at least this much (nats per measurement) are scan-matched. */
export const PROBE_DROP_NATS = 1.0;
/** Matched steps are at least this far apart (s); runs bridge the gaps between them. */
export const PROBE_SPACING = 0.3;
/** Upper bound on scan-matched steps per replay, to keep the detector fast on long failing runs. */
export const MAX_PROBES = 60;
/** Scans with fewer returns than this are not matched (too little to place the robot). */
export const PROBE_MIN_ENDPOINTS = 20;
/** Offset that marks a step: position (m) or heading (rad) ... */
export const OFFSET_POSITION = 0.3;
export const OFFSET_HEADING = 0.15;
/** ... when the match fits better than the mean pose by at least this much per endpoint (nats). */
export const OFFSET_MIN_GAIN = 0.3;
/** Offset (m) from which the flag is critical. */
export const OFFSET_CRITICAL_POSITION = 0.5;
export const OFFSET_CRITICAL_HEADING = 0.3;
export const DISAGREEMENT_MIN_DURATION = 0.2;
/**
 * An interval marked by drift alone must last this long (s): a slip or a miscalibration keeps
 * pulling, while a particle set thinning out in a tight turn makes its mean jump for a few steps.
 */
export const DRIFT_MIN_DURATION = 1;
export const DISAGREEMENT_MAX_GAP = 0.5;

interface Signals {
  heading: Float64Array;
  position: Float64Array;
  /** Thresholds per step: the fixed floor or DRIFT_EXPECTED_SIGMAS expected spreads, whichever is larger. */
  headingLimit: Float64Array;
  positionLimit: Float64Array;
  offsetPosition: Float64Array;
  offsetHeading: Float64Array;
}

/** Trailing sums of the measurement corrections over DRIFT_WINDOW seconds (heading in rad, position in m). */
export function sumCorrections(
  series: ReplaySeries,
  signals: { heading: Float64Array; position: Float64Array },
): void {
  let first = 1;
  let sx = 0;
  let sy = 0;
  let st = 0;
  // Step 0's correction is the first weighting of the initial belief, not an odometry increment.
  for (let k = 1; k < series.t.length; k++) {
    sx += series.correction_x[k];
    sy += series.correction_y[k];
    st += series.correction_theta[k];
    while (series.t[first] <= series.t[k] - DRIFT_WINDOW) {
      sx -= series.correction_x[first];
      sy -= series.correction_y[first];
      st -= series.correction_theta[first];
      first++;
    }
    signals.heading[k] = st;
    signals.position[k] = hypot(sx, sy);
  }
}

/** Per-step drift thresholds from the fixed floors and the motion model's expected spread. */
function setDriftLimits(signals: Signals, expected: ExpectedCorrection | undefined): void {
  for (let k = 0; k < signals.heading.length; k++) {
    signals.headingLimit[k] = Math.max(
      DRIFT_HEADING,
      expected ? DRIFT_EXPECTED_SIGMAS * expected.heading[k] : 0,
    );
    signals.positionLimit[k] = Math.max(
      DRIFT_POSITION,
      expected ? DRIFT_EXPECTED_SIGMAS * expected.position[k] : 0,
    );
  }
}

function isDrifting(signals: Signals, k: number): boolean {
  return (
    Math.abs(signals.heading[k]) >= signals.headingLimit[k] || signals.position[k] >= signals.positionLimit[k]
  );
}

function describe(series: ReplaySeries, signals: Signals, run: StepRun): { text: string; critical: boolean } {
  let heading = 0;
  let position = 0;
  let offset = 0;
  let offsetHeading = 0;
  let headingLimit = 0;
  let positionLimit = 0;
  let drifted = false;
  for (let k = run.first; k <= run.last; k++) {
    if (Math.abs(signals.heading[k]) > Math.abs(heading)) {
      heading = signals.heading[k];
      headingLimit = signals.headingLimit[k];
    }
    if (signals.position[k] > position) {
      position = signals.position[k];
      positionLimit = signals.positionLimit[k];
    }
    if (isDrifting(signals, k)) drifted = true;
    if (signals.offsetPosition[k] > offset) offset = signals.offsetPosition[k];
    if (Math.abs(signals.offsetHeading[k]) > Math.abs(offsetHeading))
      offsetHeading = signals.offsetHeading[k];
  }
  const seconds = fixed(runSeconds(series.t, run));
  const parts: string[] = [];
  if (offset > 0 || offsetHeading !== 0)
    parts.push(
      `the scans fit best up to ${fixed(offset, 2)} m and ${fixed((offsetHeading * 180) / Math.PI, 0)}° away from the odometry-driven pose`,
    );
  if (drifted)
    parts.push(
      `the scans kept correcting odometry by up to ${fixed(heading, 2)} rad and ${fixed(position, 2)} m per ${DRIFT_WINDOW} s ` +
        `(the motion model's noise allows about ${fixed(headingLimit, 2)} rad and ${fixed(positionLimit, 2)} m there)`,
    );
  const critical = offset >= OFFSET_CRITICAL_POSITION || Math.abs(offsetHeading) >= OFFSET_CRITICAL_HEADING;
  return { text: `For ${seconds} s ${parts.join(', and ')}.`, critical };
}

/** Flags intervals where odometry and scans disagree about the robot's motion. */
export function detectOdometryScanDisagreement(
  series: ReplaySeries,
  profile: EvidenceProfile,
  context: ReplayContext | undefined,
  counts: FreeSpaceEndpointCounts | undefined,
): ReplayFlag[] {
  const steps = series.t.length;
  const signals: Signals = {
    heading: new Float64Array(steps),
    position: new Float64Array(steps),
    offsetPosition: new Float64Array(steps),
    offsetHeading: new Float64Array(steps),
    headingLimit: new Float64Array(steps),
    positionLimit: new Float64Array(steps),
  };
  sumCorrections(series, signals);
  const expected = context
    ? measureExpectedCorrection(
        series.t,
        context.bundle.odometry,
        context.settings.motion.alpha,
        DRIFT_WINDOW,
      )
    : undefined;
  setDriftLimits(signals, expected);
  const marked = new Uint8Array(steps);
  for (let k = 0; k < steps; k++) if (isDrifting(signals, k)) marked[k] = 1;
  if (context?.beams && context.field && counts) {
    const work = createScanMatchWorkspace(context.beams.indices.length);
    let probes = 0;
    let lastProbe = Number.NEGATIVE_INFINITY;
    for (let k = 0; k < steps && probes < MAX_PROBES; k++) {
      if (!(profile.dropPerMeasurement[k] >= PROBE_DROP_NATS)) continue;
      if (counts.fitting[k] >= MAP_MIN_FIT_SHARE * counts.total[k]) continue;
      if (series.t[k] - lastProbe < PROBE_SPACING) continue;
      lastProbe = series.t[k];
      probes++;
      const offset = findScanOffset(context, series, k, work, PROBE_MIN_ENDPOINTS);
      if (!offset || offset.gainPerEndpoint < OFFSET_MIN_GAIN) continue;
      const distance = hypot(offset.dx, offset.dy);
      if (distance < OFFSET_POSITION && Math.abs(offset.dtheta) < OFFSET_HEADING) continue;
      signals.offsetPosition[k] = distance;
      signals.offsetHeading[k] = offset.dtheta;
      marked[k] = 1;
    }
  }
  const hasOffset = (run: StepRun) => {
    for (let k = run.first; k <= run.last; k++)
      if (signals.offsetPosition[k] > 0 || signals.offsetHeading[k] !== 0) return true;
    return false;
  };
  const runs = findSustainedRuns(series.t, marked, DISAGREEMENT_MIN_DURATION, DISAGREEMENT_MAX_GAP).filter(
    (run) => hasOffset(run) || runSeconds(series.t, run) >= DRIFT_MIN_DURATION - 1e-9,
  );
  return runs.map((run) => {
    const { text, critical } = describe(series, signals, run);
    return {
      kind: 'odometry_disagrees_with_scans',
      start: series.t[run.first],
      end: series.t[run.last],
      severity: critical ? 'critical' : 'warning',
      evidence: text,
    };
  });
}
