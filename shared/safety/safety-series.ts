/**
 * Per-step clearance, stopping and contact numbers of a replay (see docs/safety-analysis.md).
 * "Had" = the reference pose when the bundle has one (else the replay's mean) against the map AND
 * the scans; "believed" = the onboard pose against the map only, as the robot saw it.
 */
import type { Bundle, Footprint } from '../bundle/types';
import type { ReplaySeries } from '../engine/replay-series';
import { buildStepTimeline } from '../engine/step-timeline';
import { travelOnGrid } from './clearance-ahead';
import { buildObstacleField, footprintToGrid, type ObstacleField } from './grid-clearance';
import { poseAtSteps, type StepPoses } from './pose-at-steps';
import { CHI2_2DOF_95, type SafetySettings } from './safety-settings';
import { footprintToPoints, robotFrameReturns, travelToPoints } from './scan-returns';
import { stoppingDistance } from './stopping-distance';
import { commandSpeedAtSteps, odometrySpeedAtSteps } from './travel-speed';

/** The replay series columns the analysis reads (map frame; m, rad, m^2). */
export type BeliefSeries = Pick<ReplaySeries, 't' | 'x' | 'y' | 'theta' | 'cov_xx' | 'cov_xy' | 'cov_yy'>;

/** Scans older than this (s) at a step are not used for it. */
const MAX_SCAN_AGE = 0.3;
/** Searched beyond the stopping distance (m) for the clearance ahead. */
const EXTRA_LOOKAHEAD = 3;
/** Below this speed (m/s) the robot counts as standing; the clearance ahead is taken forward. */
const STANDING = 0.01;

export interface StepSeries {
  hadBasis: 'reference' | 'replay';
  /** 1 where the reference track gives a pose at the step. */
  referenceKnown: Uint8Array;
  scan: Float64Array;
  mapReference: Float64Array;
  mapReplay: Float64Array;
  mapOnboard: Float64Array;
  speed: Float64Array;
  stoppingDistance: Float64Array;
  stoppingTime: Float64Array;
  aheadHad: Float64Array;
  aheadMapHad: Float64Array;
  aheadBelieved: Float64Array;
  positionUncertainty95: Float64Array;
  field?: ObstacleField;
}

const nan = (n: number) => new Float64Array(n).fill(Number.NaN);
const orNaN = (value: number | null) => (value === null ? Number.NaN : value);

function mapClearances(
  field: ObstacleField | undefined,
  footprint: Footprint,
  poses: StepPoses,
): Float64Array {
  const out = nan(poses.x.length);
  if (!field) return out;
  for (let s = 0; s < out.length; s++)
    out[s] = orNaN(footprintToGrid(field, footprint, poses.x[s], poses.y[s], poses.theta[s]));
  return out;
}

/**
 * Each value replaced by the median of it and its two neighbours in time (NaN ignored): something
 * really there is seen by consecutive scans, a spurious cluster of returns in one scan is not.
 */
export function medianOfThree(values: Float64Array): Float64Array {
  const out = new Float64Array(values.length);
  for (let s = 0; s < values.length; s++) {
    const neighbours = [values[s - 1], values[s], values[s + 1]].filter(
      (v) => v !== undefined && !Number.isNaN(v),
    );
    neighbours.sort((a, b) => a - b);
    out[s] = Number.isNaN(values[s])
      ? Number.NaN
      : neighbours.length === 3
        ? neighbours[1]
        : Math.max(...neighbours);
  }
  return out;
}

/** 95 % radius (m) of a 2-D Gaussian position belief: sqrt(chi2_2(0.95) * largest eigenvalue). */
export function radius95(xx: number, xy: number, yy: number): number {
  const mean = (xx + yy) / 2;
  const half = (xx - yy) / 2;
  const largest = mean + Math.sqrt(half * half + xy * xy);
  return Math.sqrt(CHI2_2DOF_95 * Math.max(0, largest));
}

export function computeStepSeries(
  bundle: Bundle,
  belief: BeliefSeries,
  settings: SafetySettings,
): StepSeries {
  const n = belief.t.length;
  const { footprint, reaction_time, max_decel } = bundle.manifest.robot;
  const field = bundle.map.grid ? buildObstacleField(bundle.map.grid) : undefined;
  const replay: StepPoses = { x: belief.x, y: belief.y, theta: belief.theta };
  const reference = poseAtSteps(bundle.reference, belief.t);
  const onboard = poseAtSteps(bundle.onboard, belief.t);
  const hasReference = reference.x.some(Number.isFinite);
  const had = hasReference ? reference : replay;
  const out: StepSeries = {
    hadBasis: hasReference ? 'reference' : 'replay',
    referenceKnown: Uint8Array.from(reference.x, (x) => (Number.isFinite(x) ? 1 : 0)),
    scan: nan(n),
    mapReference: mapClearances(field, footprint, reference),
    mapReplay: mapClearances(field, footprint, replay),
    mapOnboard: mapClearances(field, footprint, onboard),
    speed:
      settings.speed_source === 'commands' && bundle.commands
        ? commandSpeedAtSteps(bundle.commands, belief.t)
        : odometrySpeedAtSteps(bundle.odometry).slice(0, n),
    stoppingDistance: nan(n),
    stoppingTime: nan(n),
    aheadHad: nan(n),
    aheadMapHad: nan(n),
    aheadBelieved: nan(n),
    positionUncertainty95: nan(n),
    field,
  };
  const timeline = buildStepTimeline(bundle);
  const scanConfig = bundle.manifest.scan;
  let points: Float64Array | undefined;
  let pointsTime = Number.NEGATIVE_INFINITY;
  for (let s = 0; s < n; s++) {
    const t = belief.t[s];
    if (bundle.scans && scanConfig && timeline.scanStart[s + 1] > timeline.scanStart[s]) {
      const last = timeline.scanStart[s + 1] - 1;
      points = robotFrameReturns(bundle.scans, last, scanConfig);
      pointsTime = bundle.scans.t[last];
    }
    const scanPoints = points && t - pointsTime <= MAX_SCAN_AGE ? points : undefined;
    if (scanPoints) out.scan[s] = orNaN(footprintToPoints(footprint, scanPoints));
    const v = out.speed[s];
    const stop = stoppingDistance({
      speed: v,
      reactionTime: reaction_time,
      deceleration: max_decel,
      brakingMargin: settings.braking_margin,
    });
    out.stoppingDistance[s] = stop.total;
    out.stoppingTime[s] = stop.time;
    const direction = v < -STANDING ? -1 : 1;
    const lookahead = stop.total + EXTRA_LOOKAHEAD;
    const scanAhead = scanPoints ? (travelToPoints(footprint, scanPoints, direction) ?? lookahead) : null;
    const mapAhead = field
      ? travelOnGrid(field, footprint, had.x[s], had.y[s], had.theta[s], direction, lookahead)
      : null;
    out.aheadMapHad[s] = orNaN(mapAhead);
    const candidates = [scanAhead, mapAhead].filter((value): value is number => value !== null);
    const poseKnown = Number.isFinite(had.x[s]);
    if (poseKnown && candidates.length > 0) out.aheadHad[s] = Math.min(lookahead, ...candidates);
    if (field) {
      out.aheadBelieved[s] = orNaN(
        travelOnGrid(field, footprint, onboard.x[s], onboard.y[s], onboard.theta[s], direction, lookahead),
      );
    }
    out.positionUncertainty95[s] = radius95(belief.cov_xx[s], belief.cov_xy[s], belief.cov_yy[s]);
  }
  out.scan = medianOfThree(out.scan);
  return out;
}
