/**
 * odometry_fault and external_displacement: both start from an `odometry_disagrees_with_scans`
 * flag. A fault in the odometry (slip, skid, a scale error) keeps pulling: the scans correct it
 * step after step, and a replay allowed more odometry noise follows the scans better. A push
 * moves the robot at once: a scan match finds the scans fitting far from the odometry-driven
 * pose, and a replay re-initialised at that pose fits the scans again.
 */
import { fixed } from '../flags/intervals';
import { MAP_MIN_FIT_SHARE } from '../flags/map-out-of-date';
import { DRIFT_WINDOW } from '../flags/odometry-scan-disagreement';
import { createScanMatchWorkspace, findScanOffset } from '../flags/scan-match-offset';
import { hypot } from '../numerics';
import type { CauseEvidence } from './cause-evidence';
import type { ScoredCause } from './cause-score';
import type { CauseInput, CounterfactualRun } from './cause-types';
import {
  compareEvidence,
  meanEssShare,
  type RunCounterfactual,
  stepAt,
  windowAround,
  windowSettings,
} from './counterfactual-runner';

/** Odometry noise (all four alpha) is multiplied by this in the counterfactual. */
export const ODOMETRY_NOISE_FACTOR = 4;
/**
 * Rise in the mean ESS share over the interval, with inflated noise, that supports an odometry
 * fault: the widened prediction then covers the motion the scans demand, so the weights even out.
 * Where odometry was right, a wider prediction only spreads the particles and the share falls.
 */
export const ODOMETRY_MIN_ESS_GAIN = 0.04;
/** Scan-match offset (m) that reads as a displacement rather than drift. */
export const DISPLACEMENT_MIN_OFFSET = 0.3;
/** Evidence gain (nats per measurement) after re-initialising at the scan-match pose that supports a displacement. */
export const DISPLACEMENT_MIN_GAIN = 0.5;
/** Steps scan-matched per interval, at most, and their minimum returns. */
const MAX_PROBES = 20;
const PROBE_MIN_ENDPOINTS = 20;
/** Summed heading correction (rad per DRIFT_WINDOW) that counts as full evidence of drift. */
const FULL_DRIFT_HEADING = 0.3;

interface Offset {
  step: number;
  distance: number;
  dx: number;
  dy: number;
  dtheta: number;
}

/**
 * The first scan-match offset of at least DISPLACEMENT_MIN_OFFSET in [first, last] (when the
 * robot was moved), else the largest, on steps where most of the scan no longer fits.
 */
function largestOffset(
  input: CauseInput,
  evidence: CauseEvidence,
  first: number,
  last: number,
): Offset | undefined {
  const { context, series } = input;
  if (!context.beams || !context.field) return undefined;
  const work = createScanMatchWorkspace(context.beams.indices.length);
  const stride = Math.max(1, Math.floor((last - first + 1) / MAX_PROBES));
  let best: Offset | undefined;
  for (let k = first; k <= last; k += stride) {
    if (evidence.counts.fitting[k] >= MAP_MIN_FIT_SHARE * evidence.counts.total[k]) continue;
    const offset = findScanOffset(context, series, k, work, PROBE_MIN_ENDPOINTS);
    if (!offset) continue;
    const distance = hypot(offset.dx, offset.dy);
    if (!best || distance > best.distance) best = { step: k, distance, ...offset };
    if (distance >= DISPLACEMENT_MIN_OFFSET) return best;
  }
  return best;
}

/** Peak summed heading correction (rad per DRIFT_WINDOW s) over [first, last]. */
function peakDrift(evidence: CauseEvidence, first: number, last: number): number {
  let peak = 0;
  for (let k = first; k <= last; k++)
    if (Math.abs(evidence.drift.heading[k]) > Math.abs(peak)) peak = evidence.drift.heading[k];
  return peak;
}

function odometryFault(
  input: CauseInput,
  run: RunCounterfactual,
  start: number,
  end: number,
  drift: number,
  offset?: Offset,
): ScoredCause {
  const span = windowAround(input.series, start, end);
  const alpha = input.settings.motion.alpha.map((a) => a * ODOMETRY_NOISE_FACTOR) as [
    number,
    number,
    number,
    number,
  ];
  const inflated = windowSettings(input, span, { motion: { model: 'odometry', alpha } });
  const compared = compareEvidence(input, run, inflated, start, end);
  const gain = compared.gain;
  const essGain = meanEssShare(compared.series, start, end) - meanEssShare(compared.baseline, start, end);
  const counterfactual: CounterfactualRun = {
    label: `Odometry noise ×${ODOMETRY_NOISE_FACTOR} over ${fixed(span.start)}-${fixed(span.end)} s`,
    settings: inflated,
    digest: compared.digest,
    metric: 'rise in the mean effective sample size over the interval (share of the particles)',
    value: essGain,
    supports: essGain >= ODOMETRY_MIN_ESS_GAIN,
  };
  const strength = Math.min(1, Math.abs(drift) / FULL_DRIFT_HEADING);
  const jump = offset && offset.distance >= DISPLACEMENT_MIN_OFFSET;
  return {
    kind: 'odometry_fault',
    start,
    end,
    strength: jump ? strength / 2 : strength,
    evidence:
      `The scans kept correcting odometry by up to ${fixed(drift, 2)} rad per ${DRIFT_WINDOW} s for ${fixed(end - start)} s; ` +
      `with odometry noise ×${ODOMETRY_NOISE_FACTOR} the mean effective sample size ${essGain >= 0 ? 'rose' : 'fell'} by ${fixed(Math.abs(essGain) * 100, 1)} % of the particles and the scans fit ${fixed(gain, 2)} nats per measurement ${gain >= 0 ? 'better' : 'worse'}.`,
    against: jump
      ? `A scan match puts the robot ${fixed(offset.distance, 2)} m from the odometry-driven pose at ${fixed(input.series.t[offset.step])} s, a jump rather than a drift.`
      : essGain < ODOMETRY_MIN_ESS_GAIN
        ? `More odometry noise did not even out the weights (mean ESS share ${fixed(essGain * 100, 1)} %, at least ${fixed(ODOMETRY_MIN_ESS_GAIN * 100, 0)} % needed).`
        : '',
    counterfactuals: [counterfactual],
    gain,
  };
}

function externalDisplacement(
  input: CauseInput,
  run: RunCounterfactual,
  start: number,
  end: number,
  offset: Offset,
): ScoredCause {
  const { series } = input;
  const at = series.t[offset.step];
  const span = { start: at, end: windowAround(series, start, end).end };
  const pose = {
    x: series.x[offset.step] + offset.dx,
    y: series.y[offset.step] + offset.dy,
    theta: series.theta[offset.step] + offset.dtheta,
  };
  const moved = windowSettings(input, span, {}, pose);
  const { gain, digest } = compareEvidence(input, run, moved, at, span.end);
  const counterfactual: CounterfactualRun = {
    label: `Re-initialised at the scan-match pose (${fixed(pose.x, 2)}, ${fixed(pose.y, 2)}) m at ${fixed(at)} s`,
    settings: moved,
    digest,
    metric: 'gain in median log-likelihood per measurement after the re-initialisation (nats)',
    value: gain,
    supports: gain >= DISPLACEMENT_MIN_GAIN,
  };
  return {
    kind: 'external_displacement',
    start,
    end,
    strength: Math.min(1, offset.distance / (2 * DISPLACEMENT_MIN_OFFSET)),
    evidence:
      `At ${fixed(at)} s the scans fit best ${fixed(offset.distance, 2)} m and ${fixed((offset.dtheta * 180) / Math.PI, 0)}° from the odometry-driven pose; ` +
      `re-initialised there, the replay fits the scans ${fixed(gain, 2)} nats per measurement ${gain >= 0 ? 'better' : 'worse'}.`,
    against:
      gain < DISPLACEMENT_MIN_GAIN
        ? `Re-initialising at the scan-match pose gained only ${fixed(gain, 2)} nats per measurement (at least ${DISPLACEMENT_MIN_GAIN} needed).`
        : '',
    counterfactuals: [counterfactual],
    gain,
  };
}

/** Candidate odometry faults and displacements, one or two per odometry-disagreement flag. */
export function findOdometryCauses(
  input: CauseInput,
  evidence: CauseEvidence,
  run: RunCounterfactual,
): ScoredCause[] {
  const causes: ScoredCause[] = [];
  for (const flag of input.flags) {
    if (flag.kind !== 'odometry_disagrees_with_scans') continue;
    const first = stepAt(input.series, flag.start);
    const last = stepAt(input.series, flag.end);
    const offset = largestOffset(input, evidence, first, last);
    causes.push(odometryFault(input, run, flag.start, flag.end, peakDrift(evidence, first, last), offset));
    if (offset && offset.distance >= DISPLACEMENT_MIN_OFFSET)
      causes.push(externalDisplacement(input, run, flag.start, flag.end, offset));
  }
  return causes;
}
