/**
 * input_gap and odometry_jump: holes in the recorded input streams (odometry, scans) and odometry
 * poses that moved further between rows than the robot can drive. Detections are not checked:
 * they arrive only while landmarks are in view, so their gaps are normal.
 */

import type { Bundle } from '../../bundle/types';
import { hypot } from '../numerics';
import type { ReplayFlag } from './flag-types';
import { findSustainedRuns, fixed, medianInPlace } from './intervals';

/** A gap is an interval between rows longer than this many median periods ... */
export const GAP_PERIODS = 3;
/** ... and longer than the median period plus this slack (s), so jittery fast streams do not trip it. */
export const GAP_SLACK = 0.2;
/** Odometry gaps longer than this (s) are critical: the replay then applies one large motion. */
export const GAP_CRITICAL_SECONDS = 1;
/** An odometry row jumps when it moved more than max_speed * dt * JUMP_FACTOR + JUMP_SLACK (m). */
export const JUMP_FACTOR = 1.5;
export const JUMP_SLACK = 0.05;
/** Jumps further than the allowed distance plus this (m) are critical. */
export const JUMP_CRITICAL_EXCESS = 0.5;

interface Stream {
  name: string;
  t: Float64Array;
  /** Odometry gaps can be critical (one large motion update); scan gaps only leave the belief unweighted. */
  canBeCritical: boolean;
}

function medianPeriod(t: Float64Array): number {
  const periods = new Float64Array(Math.max(0, t.length - 1));
  let count = 0;
  for (let k = 1; k < t.length; k++) if (t[k] > t[k - 1]) periods[count++] = t[k] - t[k - 1];
  return medianInPlace(periods, count);
}

function detectGaps(stream: Stream): ReplayFlag[] {
  const { t } = stream;
  const period = medianPeriod(t);
  if (!Number.isFinite(period)) return [];
  const limit = Math.max(GAP_PERIODS * period, period + GAP_SLACK);
  const flags: ReplayFlag[] = [];
  for (let k = 1; k < t.length; k++) {
    const gap = t[k] - t[k - 1];
    if (gap <= limit) continue;
    const critical = stream.canBeCritical && gap > GAP_CRITICAL_SECONDS;
    flags.push({
      kind: 'input_gap',
      start: t[k - 1],
      end: t[k],
      severity: critical ? 'critical' : 'warning',
      evidence: `No ${stream.name} rows for ${fixed(gap, 2)} s (median period ${fixed(period, 3)} s).`,
    });
  }
  return flags;
}

function detectOdometryJumps(bundle: Bundle): ReplayFlag[] {
  const { t, x, y } = bundle.odometry;
  const maxSpeed = bundle.manifest.robot.max_speed;
  const marked = new Uint8Array(t.length);
  const excess = new Float64Array(t.length);
  for (let k = 1; k < t.length; k++) {
    const allowed = maxSpeed * (t[k] - t[k - 1]) * JUMP_FACTOR + JUMP_SLACK;
    const moved = hypot(x[k] - x[k - 1], y[k] - y[k - 1]);
    excess[k] = moved - allowed;
    if (excess[k] > 0) marked[k] = 1;
  }
  return findSustainedRuns(t, marked, 0, 0.5).map((run) => {
    let worst = run.first;
    for (let k = run.first; k <= run.last; k++) if (excess[k] > excess[worst]) worst = k;
    const moved = hypot(x[worst] - x[worst - 1], y[worst] - y[worst - 1]);
    const dt = t[worst] - t[worst - 1];
    return {
      kind: 'odometry_jump',
      start: t[run.first - 1],
      end: t[run.last],
      severity: excess[worst] > JUMP_CRITICAL_EXCESS ? 'critical' : 'warning',
      evidence: `Odometry moved ${fixed(moved, 2)} m in ${fixed(dt, 2)} s, more than the ${fixed(maxSpeed, 1)} m/s top speed allows.`,
    };
  });
}

/** Gaps in the odometry and scan streams, and odometry jumps. */
export function detectInputStreamProblems(bundle: Bundle): ReplayFlag[] {
  const streams: Stream[] = [{ name: 'odometry', t: bundle.odometry.t, canBeCritical: true }];
  if (bundle.scans) streams.push({ name: 'scan', t: bundle.scans.t, canBeCritical: false });
  return [...streams.flatMap(detectGaps), ...detectOdometryJumps(bundle)];
}
