import type { RecoveryConfig, RobotInfo } from '../../shared/bundle/types';
import type { LaserNoise } from './laser-scanner';
import type { PersonSpec } from './people';
import type { Pose } from './pose-math';
import type { WorldChanges } from './site-layout';

export type Waypoints = ReadonlyArray<readonly [number, number]>;

/** A fault as the catalog lists it: kind and interval in bundle seconds. */
export interface InjectedFault {
  kind: 'wheel_slip' | 'moved_rack' | 'kidnap' | 'degraded_sensor' | 'encoder_scale';
  start: number;
  end: number;
}

export interface ScriptedEvent {
  t: number;
  kind: string;
  detail: string;
}

/** Everything that makes one sample incident what it is. */
export interface ScenarioSpec {
  /** Folder name under sample-logs/. */
  name: string;
  /** One-line story for the catalog. */
  story: string;
  seed: number;
  /** s */
  duration: number;
  robot: RobotInfo;
  startTime: string;
  /** True start pose, map frame. */
  start: Pose;
  route: Waypoints;
  world: WorldChanges;
  /** People the scanner sees but the map does not have (standing or pacing beside the route). */
  people?: readonly PersonSpec[];
  /** True odometry noise when it differs from TRUE_ODOMETRY_ALPHA (variance coefficients); the manifest keeps the normal alphas. */
  odometryAlpha?: readonly [number, number, number, number];
  /** Odometry reports an extra yaw rate (rad/s) the robot never turned: a wheel spinning on a wet patch. */
  slip?: { start: number; end: number; yawRate: number };
  /** Odometry reports travelled distance times `factor` (a worn or mis-set wheel radius), from start to end (s). */
  encoderScale?: { start: number; end: number; factor: number };
  /** An outside force shoves the robot sideways (m, robot frame +y = left) while the wheels see nothing. */
  push?: { start: number; duration: number; lateral: number; rotation: number; detail: string };
  degradedLaser?: { start: number; end: number; noise: LaserNoise };
  /** The onboard localizer locks onto a wrong match from this time (offset in the map frame). */
  onboardOffset?: { start: number; rampSeconds: number; offset: Pose };
  /** Route the operator gives the robot after the first protective stop, if it changes. */
  rerouteAfterStop?: Waypoints;
  /** Operator notes written when the robot is re-localized after each protective stop, in order. */
  stopNotes: string[];
  scriptedEvents: ScriptedEvent[];
  recovery?: RecoveryConfig;
}
