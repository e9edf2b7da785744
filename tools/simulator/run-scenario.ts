import type { Detection, DetectorSettings } from './landmark-detector';
import { simulateDetections } from './landmark-detector';
import { castScan, HEALTHY_LASER, type ScanGeometry, simulateScan } from './laser-scanner';
import { corruptIncrement, decomposeIncrement, incrementToPose } from './odometry-noise';
import { type OnboardCovariance, OnboardLocalizer } from './onboard-localizer';
import { clearPeople, stampPeople } from './people';
import { composePose, integrateTwist, normalizeAngle, type Pose } from './pose-math';
import { createStream } from './random-source';
import { castRay } from './ray-cast';
import { CONTACT_CLEARANCE, SafetyMonitor } from './safety-monitor';
import type { InjectedFault, ScenarioSpec, ScriptedEvent } from './scenario-types';
import { clearanceAt } from './sim-grid';
import { buildSite, type SiteWorld } from './site-layout';
import { WaypointController } from './waypoint-controller';

/** s between odometry rows, commands and scans (10 Hz). */
export const STEP_SECONDS = 0.1;
/** True odometry noise of the simulated drive (variance coefficients, Thrun et al. 2005, Table 5.6). */
export const TRUE_ODOMETRY_ALPHA: [number, number, number, number] = [0.05, 0.005, 0.01, 0.002];
const ACCELERATION = 0.6;
const STOP_HOLD_SECONDS = 4;
/** After a stop this close to a structure (m), the operator first jogs the robot this far clear (m). */
const JOG_CLEARANCE = 0.3;
const JOG_DISTANCE = 0.4;
const REFERENCE_SIGMA_XY = 0.015;
const REFERENCE_SIGMA_THETA = 0.01;
/** A scan disagrees with the map when this share of beams differ from the map's ranges by > 0.3 m. */
const MAP_MISMATCH_SHARE = 0.1;

export interface TimedPose extends Pose {
  t: number;
}

/** Everything one run produces, before it is formatted into bundle files. */
export interface SimulationRecord {
  spec: ScenarioSpec;
  mapWorld: SiteWorld;
  truth: TimedPose[];
  odometry: TimedPose[];
  commands: { t: number; v: number; omega: number }[];
  scans: { t: number; ranges: (number | null)[] }[];
  detections: { t: number; detections: Detection[] }[];
  onboard: (TimedPose & { cov: OnboardCovariance })[];
  reference: TimedPose[];
  events: ScriptedEvent[];
  faults: InjectedFault[];
}

export interface RunSettings {
  scan: ScanGeometry;
  detector: DetectorSettings;
}

function isActive(interval: { start: number; end: number } | undefined, t: number): boolean {
  return interval !== undefined && t >= interval.start && t < interval.end;
}

/** Bearing (rad, robot frame) of the nearest obstacle, sampled with 16 rays out to 3 m. */
function nearestObstacleBearing(world: SiteWorld, robot: Pose): number {
  let bestRange = Number.POSITIVE_INFINITY;
  let bestBearing = 0;
  for (let k = 0; k < 16; k++) {
    const bearing = -Math.PI + (k * Math.PI) / 8;
    const range = castRay(world.grid, robot.x, robot.y, robot.theta + bearing, 3);
    if (range < bestRange) {
      bestRange = range;
      bestBearing = bearing;
    }
  }
  return bestBearing;
}

/** Where the nearest obstacle lies relative to the robot, in words, for event details. */
function nearestObstacleSide(world: SiteWorld, robot: Pose): string {
  const bearing = nearestObstacleBearing(world, robot);
  if (Math.abs(bearing) <= Math.PI / 4) return 'front';
  if (Math.abs(bearing) >= (3 * Math.PI) / 4) return 'rear';
  return bearing > 0 ? 'left side' : 'right side';
}

/** A point `distance` m straight away from the nearest obstacle: where an operator jogs the robot to. */
function pointAwayFromObstacle(world: SiteWorld, robot: Pose, distance: number): [number, number] {
  const away = robot.theta + nearestObstacleBearing(world, robot) + Math.PI;
  return [robot.x + distance * Math.cos(away), robot.y + distance * Math.sin(away)];
}

/** Share of beams whose true range and the map's range differ by more than 0.3 m. */
function mapMismatchShare(trueRanges: Float64Array, mapRanges: Float64Array): number {
  let differing = 0;
  for (let k = 0; k < trueRanges.length; k++) {
    const a = trueRanges[k];
    const b = mapRanges[k];
    if (Number.isFinite(a) !== Number.isFinite(b) || Math.abs(a - b) > 0.3) differing++;
  }
  return differing / trueRanges.length;
}

/**
 * Simulates one scenario at 10 Hz: the controller steers from the onboard belief, the truth moves
 * by the commanded twist (plus any push), odometry integrates corrupted increments in its own frame
 * starting at (0, 0, 0), and the sensors observe the TRUE world while the map is the one on file.
 */
export function runScenario(spec: ScenarioSpec, settings: RunSettings): SimulationRecord {
  const trueWorld = buildSite(spec.world);
  const mapWorld = buildSite();
  const random = {
    odometry: createStream(spec.seed, 1),
    laser: createStream(spec.seed, 2),
    detector: createStream(spec.seed, 3),
    onboard: createStream(spec.seed, 4),
    reference: createStream(spec.seed, 5),
  };
  const record: SimulationRecord = {
    spec,
    mapWorld,
    truth: [],
    odometry: [],
    commands: [],
    scans: [],
    detections: [],
    onboard: [],
    reference: [],
    events: [...spec.scriptedEvents],
    faults: [],
  };
  const radius = spec.robot.footprint.shape === 'circle' ? spec.robot.footprint.radius : 0.4;
  const safety = new SafetyMonitor(spec.robot.reaction_time, STOP_HOLD_SECONDS, record.events);
  const controller = new WaypointController(spec.route);
  const onboard = new OnboardLocalizer(spec.start, random.onboard);
  let truth: Pose = { ...spec.start };
  let odometry: Pose = { x: 0, y: 0, theta: 0 };
  let speed = 0;
  let mismatchStart = -1;
  let mismatchEnd = -1;
  let noteIndex = 0;
  const steps = Math.round(spec.duration / STEP_SECONDS);

  for (let k = 0; k < steps; k++) {
    const t = Number((k * STEP_SECONDS).toFixed(1));
    record.truth.push({ t, ...truth });
    record.odometry.push({ t, ...odometry });
    record.onboard.push({ t, ...onboard.belief, cov: onboard.covariance });
    const beforePeople = spec.people ? stampPeople(trueWorld.grid, spec.people, t) : undefined;
    const trueRanges = castScan(trueWorld.grid, truth, settings.scan);
    const laserNoise = isActive(spec.degradedLaser, t) ? spec.degradedLaser!.noise : HEALTHY_LASER;
    record.scans.push({ t, ranges: simulateScan(trueRanges, settings.scan, laserNoise, random.laser) });
    if (
      spec.world.movedRack &&
      mapMismatchShare(trueRanges, castScan(mapWorld.grid, truth, settings.scan)) > MAP_MISMATCH_SHARE
    ) {
      if (mismatchStart < 0) mismatchStart = t;
      mismatchEnd = t;
    }
    if (k % 2 === 0) {
      const found = simulateDetections(
        trueWorld.grid,
        trueWorld.landmarks,
        truth,
        settings.detector,
        random.detector,
      );
      record.detections.push({ t, detections: found });
    }
    if (beforePeople) clearPeople(trueWorld.grid, beforePeople);
    if (k % 2 !== 0) {
      record.reference.push({
        t,
        x: truth.x + REFERENCE_SIGMA_XY * random.reference.standardNormal(),
        y: truth.y + REFERENCE_SIGMA_XY * random.reference.standardNormal(),
        theta: normalizeAngle(truth.theta + REFERENCE_SIGMA_THETA * random.reference.standardNormal()),
      });
    }

    if (spec.slip && t === spec.slip.start) onboard.startDeadReckoning();
    if (spec.onboardOffset && t === spec.onboardOffset.start) {
      onboard.startOffset(
        spec.onboardOffset.offset,
        Math.round(spec.onboardOffset.rampSeconds / STEP_SECONDS),
      );
    }
    if (spec.push && t === spec.push.start) {
      onboard.startDeadReckoning();
      record.events.push({ t, kind: 'contact', detail: spec.push.detail });
      safety.triggerStop(t, 'bumper pressed (rear left); drives halted', false);
    }

    const wanted = controller.command(onboard.belief, safety.speedLimit);
    const isBraking = safety.isBrakeApplied(t);
    const targetSpeed = safety.phase === 'running' || !isBraking ? wanted.v : 0;
    const rate = isBraking ? spec.robot.max_decel : ACCELERATION;
    speed = Math.max(Math.min(targetSpeed, speed + rate * STEP_SECONDS), speed - rate * STEP_SECONDS, 0);
    if (isBraking && speed < 1e-3) speed = 0;
    const omega = safety.phase === 'running' ? wanted.omega : isBraking ? 0 : wanted.omega;
    record.commands.push({ t, v: speed, omega });

    let wheelMotion = integrateTwist(speed, omega, STEP_SECONDS);
    const nextTruth = composePose(truth, wheelMotion);
    const nextT = Number(((k + 1) * STEP_SECONDS).toFixed(1));
    if (clearanceAt(trueWorld.grid, nextTruth.x, nextTruth.y, 1) - radius < CONTACT_CLEARANCE) {
      // The footprint touches a fixed structure: the bumper stops the wheels instead of driving through.
      safety.registerContact(nextT, nearestObstacleSide(trueWorld, truth));
      wheelMotion = { x: 0, y: 0, theta: 0 };
      speed = 0;
    } else {
      truth = nextTruth;
    }
    if (spec.push && t >= spec.push.start && t < spec.push.start + spec.push.duration) {
      const share = STEP_SECONDS / spec.push.duration;
      truth = composePose(truth, { x: 0, y: spec.push.lateral * share, theta: spec.push.rotation * share });
    }

    const measured = corruptIncrement(
      decomposeIncrement(wheelMotion),
      spec.odometryAlpha ?? TRUE_ODOMETRY_ALPHA,
      random.odometry,
    );
    if (isActive(spec.slip, t)) measured.rot2 += spec.slip!.yawRate * STEP_SECONDS;
    if (isActive(spec.encoderScale, t)) measured.trans *= spec.encoderScale!.factor;
    const odometryDelta = incrementToPose(measured);
    odometry = composePose(odometry, odometryDelta);
    onboard.update(truth, odometryDelta);

    const clearance = clearanceAt(trueWorld.grid, truth.x, truth.y, 2) - radius;
    const side = clearance < 0.6 ? nearestObstacleSide(trueWorld, truth) : 'none';
    safety.observe(nextT, STEP_SECONDS, clearance, side);
    if (safety.advance(nextT, speed)) {
      if (safety.relocalizeOnResume) {
        onboard.relocalize(truth);
        const note = spec.stopNotes[noteIndex++];
        if (note) record.events.push({ t: nextT, kind: 'operator_note', detail: note });
        if (noteIndex === 1 && spec.rerouteAfterStop) controller.reroute(spec.rerouteAfterStop);
        if (clearance < JOG_CLEARANCE)
          controller.insertDetour(pointAwayFromObstacle(trueWorld, truth, JOG_DISTANCE));
      }
    }
  }

  if (spec.slip) record.faults.push({ kind: 'wheel_slip', start: spec.slip.start, end: spec.slip.end });
  if (spec.encoderScale) {
    const { start, end } = spec.encoderScale;
    record.faults.push({ kind: 'encoder_scale', start, end });
  }
  if (spec.push) {
    const end = Number((spec.push.start + spec.push.duration).toFixed(1));
    record.faults.push({ kind: 'kidnap', start: spec.push.start, end });
  }
  if (spec.degradedLaser) {
    record.faults.push({
      kind: 'degraded_sensor',
      start: spec.degradedLaser.start,
      end: spec.degradedLaser.end,
    });
  }
  if (spec.world.movedRack && mismatchStart >= 0) {
    record.faults.push({ kind: 'moved_rack', start: mismatchStart, end: mismatchEnd });
  }
  record.events.sort((a, b) => a.t - b.t);
  return record;
}
