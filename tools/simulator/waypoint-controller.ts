import { normalizeAngle, type Pose } from './pose-math';

export interface VelocityCommand {
  /** m/s */
  v: number;
  /** rad/s */
  omega: number;
}

export interface ControllerSettings {
  /** Cruise speed, m/s. */
  cruiseSpeed: number;
  /** rad/s */
  maxTurnRate: number;
  /** Heading gain, 1/s. */
  headingGain: number;
  /** A waypoint counts as reached within this distance, m. */
  arrivalRadius: number;
  /** Heading error (rad) beyond which the robot turns without driving forward. */
  turnOnSpotError: number;
}

/** rad: a turn on the spot ends once the heading error is this small. */
const ALIGNED_HEADING_ERROR = 0.05;

export const DEFAULT_CONTROLLER: ControllerSettings = {
  cruiseSpeed: 0.8,
  maxTurnRate: 1.0,
  headingGain: 1.6,
  arrivalRadius: 0.5,
  turnOnSpotError: 0.3,
};

/**
 * Steers towards the current waypoint from the pose the robot BELIEVES it has (map frame): this
 * is how a wrong onboard estimate turns into a real path error. Slows down for sharp heading
 * errors so corners are taken on the spot rather than in a wide arc.
 */
export class WaypointController {
  private index = 0;
  private isTurningOnSpot = false;

  constructor(
    private route: ReadonlyArray<readonly [number, number]>,
    private readonly settings: ControllerSettings = DEFAULT_CONTROLLER,
  ) {}

  /** Replaces the remaining route (an operator re-routing the robot). */
  reroute(route: ReadonlyArray<readonly [number, number]>): void {
    this.route = route;
    this.index = 0;
  }

  /** Visits `point` first, then carries on with the route (an operator jogging the robot clear). */
  insertDetour(point: readonly [number, number]): void {
    this.route = [point, ...this.route.slice(this.index)];
    this.index = 0;
  }

  get isFinished(): boolean {
    return this.index >= this.route.length;
  }

  command(believed: Pose, speedLimit: number): VelocityCommand {
    while (!this.isFinished) {
      const [tx, ty] = this.route[this.index];
      if (Math.hypot(tx - believed.x, ty - believed.y) > this.settings.arrivalRadius) break;
      this.index++;
    }
    if (this.isFinished) return { v: 0, omega: 0 };
    const [tx, ty] = this.route[this.index];
    const headingError = normalizeAngle(Math.atan2(ty - believed.y, tx - believed.x) - believed.theta);
    const omega = Math.max(
      -this.settings.maxTurnRate,
      Math.min(this.settings.maxTurnRate, this.settings.headingGain * headingError),
    );
    // Turn on the spot when far off the bearing, and finish the turn before driving again, so a
    // robot stopped beside a rack turns away from it instead of creeping further in.
    if (Math.abs(headingError) > this.settings.turnOnSpotError) this.isTurningOnSpot = true;
    else if (Math.abs(headingError) < ALIGNED_HEADING_ERROR) this.isTurningOnSpot = false;
    const alignment = this.isTurningOnSpot ? 0 : Math.cos(headingError) ** 3;
    return { v: Math.min(speedLimit, this.settings.cruiseSpeed) * alignment, omega };
  }
}
