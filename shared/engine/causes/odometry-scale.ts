/**
 * odometry_fault, gradual: an encoder scale or calibration error makes odometry read long or
 * short by a few percent. No single step is corrected much, but over tens of seconds the scans
 * keep pulling the belief back along the direction of travel by the same share of the distance.
 * With the odometry rescaled by that share, the scans must no longer need to correct it.
 */
import { findSustainedRuns, fixed, medianInPlace } from '../flags/intervals';
import { cos, hypot, sin } from '../numerics';
import type { ReplaySeries } from '../replay-series';
import type { ScoredCause } from './cause-score';
import type { CauseInput, CounterfactualRun, CounterfactualSettings } from './cause-types';
import { buildCounterfactualBundle } from './counterfactual-bundle';
import {
  compareEvidence,
  type RunCounterfactual,
  windowAround,
  windowSettings,
} from './counterfactual-runner';

/** Trailing window (s) over which along-track corrections are compared with the distance travelled. */
export const SCALE_WINDOW = 30;
/** Distance (m) the odometry must report over the window for the share to be judged. */
export const SCALE_MIN_TRAVEL = 10;
/** Share of the distance that marks a step (committed samples, none with a scale error: at most 0.020). */
export const SCALE_SHARE = 0.03;
/** Marked steps must span at least this long (s). */
export const SCALE_MIN_DURATION = 5;
/** The rescaled counterfactual supports the cause when the share falls to at most this fraction of it. */
export const SCALE_REMAINING = 0.5;
/** Share that counts as full evidence. */
const FULL_SHARE = 0.06;

/**
 * Per step, the measurement corrections along the direction of travel summed over SCALE_WINDOW s,
 * as a share of the odometry distance in that window (negative: odometry reads long); NaN below
 * SCALE_MIN_TRAVEL.
 */
export function measureAlongTrackShare(
  series: ReplaySeries,
  odometry: CauseInput['bundle']['odometry'],
  minTravel = SCALE_MIN_TRAVEL,
): Float64Array {
  const steps = series.t.length;
  const along = new Float64Array(steps);
  const travel = new Float64Array(steps);
  const share = new Float64Array(steps).fill(Number.NaN);
  let first = 0;
  for (let k = 1; k < steps; k++) {
    const theta = series.theta[k];
    along[k] = along[k - 1] + series.correction_x[k] * cos(theta) + series.correction_y[k] * sin(theta);
    travel[k] = travel[k - 1] + hypot(odometry.x[k] - odometry.x[k - 1], odometry.y[k] - odometry.y[k - 1]);
    while (series.t[first] < series.t[k] - SCALE_WINDOW) first++;
    const distance = travel[k] - travel[first];
    if (distance >= minTravel) share[k] = (along[k] - along[first]) / distance;
  }
  return share;
}

/** Median of the finite values of `values` over [first, last]; NaN when none. */
function medianShare(values: Float64Array, first: number, last: number): number {
  const finite = new Float64Array(last - first + 1);
  let count = 0;
  for (let k = first; k <= last; k++) if (Number.isFinite(values[k])) finite[count++] = values[k];
  return medianInPlace(finite, count);
}

/** Candidate gradual odometry faults: sustained runs of a steady along-track correction share. */
export function findScaleCauses(input: CauseInput, run: RunCounterfactual): ScoredCause[] {
  const { series, bundle } = input;
  const share = measureAlongTrackShare(series, bundle.odometry);
  const marked = new Uint8Array(share.length);
  for (let k = 0; k < share.length; k++) if (Math.abs(share[k]) >= SCALE_SHARE) marked[k] = 1;
  return findSustainedRuns(series.t, marked, SCALE_MIN_DURATION, SCALE_WINDOW / 2).map((steps) => {
    const median = medianShare(share, steps.first, steps.last);
    const start = Math.max(series.t[0], series.t[steps.first] - SCALE_WINDOW);
    const end = series.t[steps.last];
    const span = windowAround(series, end - SCALE_WINDOW, end);
    const rescaled = { ...windowSettings(input, span), odometry_scale: 1 + median };
    const compared = compareEvidence(input, run, rescaled, span.start, span.end);
    // The counterfactual span is shorter than SCALE_WINDOW: judge its share over what it travelled.
    const cutOdometry = (settings: CounterfactualSettings) =>
      buildCounterfactualBundle(bundle, settings).odometry;
    const shareIn = (replayed: ReplaySeries, settings: CounterfactualSettings) =>
      medianShare(
        measureAlongTrackShare(replayed, cutOdometry(settings), SCALE_MIN_TRAVEL / 2),
        0,
        replayed.t.length - 1,
      );
    const remaining = shareIn(compared.series, rescaled);
    const before = shareIn(compared.baseline, { ...rescaled, odometry_scale: undefined });
    const counterfactual: CounterfactualRun = {
      label: `Odometry distance ×${fixed(1 + median, 3)} over ${fixed(span.start)}-${fixed(span.end)} s`,
      settings: rescaled,
      digest: compared.digest,
      metric: 'along-track correction as a share of the distance travelled, rescaled replay',
      value: remaining,
      supports: Number.isFinite(remaining) && Math.abs(remaining) <= SCALE_REMAINING * Math.abs(before),
    };
    return {
      kind: 'odometry_fault',
      start,
      end,
      strength: Math.abs(median) / FULL_SHARE,
      evidence:
        `Over ${fixed(end - start)} s the scans kept pulling the belief ${median < 0 ? 'back' : 'forward'} along its path by a median ${fixed(Math.abs(median) * 100, 1)} % of the distance odometry reported ` +
        `(at least ${fixed(SCALE_SHARE * 100, 0)} % over ${SCALE_WINDOW} s marks it): odometry reads ${median < 0 ? 'long' : 'short'}, as with a wrong wheel radius; ` +
        `with the distance rescaled the share ${fixed(before * 100, 1)} % became ${fixed(remaining * 100, 1)} %.`,
      against: counterfactual.supports
        ? ''
        : `Rescaling the odometry did not remove the correction (${fixed(remaining * 100, 1)} % left).`,
      counterfactuals: [counterfactual],
      gain: compared.gain,
    };
  });
}
