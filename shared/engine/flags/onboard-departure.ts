/**
 * onboard_departed_from_replay / onboard_departed_from_reference: the robot's own pose estimate
 * (onboard_pose.csv) stayed far from the replay, or from the reference trajectory, for a while.
 */
import type { Bundle } from '../../bundle/types';
import { createReplaySeries, type ReplaySeries } from '../replay-series';
import { computeTrajectoryErrors } from '../trajectory-error';
import type { FlagKind, ReplayFlag } from './flag-types';
import { findSustainedRuns, fixed, rangeOver, runSeconds } from './intervals';

/** Distance (m) that marks a step (healthy samples: onboard within 0.3 m of the replay throughout). */
export const ONBOARD_DISTANCE = 0.3;
/** Maximum distance (m) from which the flag is critical. */
export const ONBOARD_CRITICAL_DISTANCE = 1.0;
export const ONBOARD_MIN_DURATION = 1;
export const ONBOARD_MAX_GAP = 0.5;

function sharePerStep(values: Float64Array, first: number, last: number, bound: number): number {
  let above = 0;
  let finite = 0;
  for (let k = first; k <= last; k++) {
    if (!Number.isFinite(values[k])) continue;
    finite++;
    if (values[k] > bound) above++;
  }
  return finite > 0 ? above / finite : Number.NaN;
}

function flagsFromDistance(
  t: Float64Array,
  distance: Float64Array,
  kind: FlagKind,
  against: string,
  nees?: { values: Float64Array; bound: number },
): ReplayFlag[] {
  const marked = new Uint8Array(t.length);
  for (let k = 0; k < t.length; k++) if (distance[k] > ONBOARD_DISTANCE) marked[k] = 1;
  return findSustainedRuns(t, marked, ONBOARD_MIN_DURATION, ONBOARD_MAX_GAP).map((run) => {
    const { max } = rangeOver(distance, run);
    const share = nees ? sharePerStep(nees.values, run.first, run.last, nees.bound) : Number.NaN;
    const consistency = Number.isFinite(share)
      ? `, with NEES above its 95 % bound ${fixed(nees!.bound, 2)} in ${fixed(share * 100, 0)} % of steps`
      : '';
    return {
      kind,
      start: t[run.first],
      end: t[run.last],
      severity: max >= ONBOARD_CRITICAL_DISTANCE ? 'critical' : 'warning',
      evidence: `The onboard estimate stayed more than ${ONBOARD_DISTANCE} m from ${against} for ${fixed(runSeconds(t, run))} s (max ${fixed(max, 2)} m)${consistency}.`,
    };
  });
}

/** Onboard estimate vs the replay's mean pose, per replay step. */
export function detectOnboardDepartureFromReplay(series: ReplaySeries, neesBound: number): ReplayFlag[] {
  return flagsFromDistance(series.t, series.error_onboard, 'onboard_departed_from_replay', 'the replay', {
    values: series.nees_onboard,
    bound: neesBound,
  });
}

/** Onboard estimate vs the reference trajectory, at the onboard rows' times; empty when either is absent. */
export function detectOnboardDepartureFromReference(bundle: Bundle): ReplayFlag[] {
  const { onboard, reference } = bundle;
  if (!onboard || !reference) return [];
  // Reuse the replay's interpolating error code by treating the onboard rows as a pose series.
  const poses = createReplaySeries(onboard.t.length);
  poses.t.set(onboard.t);
  poses.x.set(onboard.x);
  poses.y.set(onboard.y);
  poses.theta.set(onboard.theta);
  computeTrajectoryErrors(poses, { ...bundle, onboard: undefined });
  return flagsFromDistance(
    poses.t,
    poses.error_reference,
    'onboard_departed_from_reference',
    'the reference',
  );
}
