import type { ScriptedEvent } from './scenario-types';

/** Clearance (m, footprint edge to nearest obstacle) below which the slow-down field is violated. */
export const WARNING_CLEARANCE = 0.45;
const WARNING_RELEASE = 0.6;
/** Clearance (m) at which the protective field stops the robot. */
export const PROTECTIVE_CLEARANCE = 0.1;
/** Closing speed (m/s) towards the obstacle above which the protective field trips; driving alongside a rack does not. */
const PROTECTIVE_CLOSING_SPEED = 0.05;
/** Below this clearance (m) the footprint is touching. */
export const CONTACT_CLEARANCE = 0.01;
/** Speed limit inside the slow-down field, m/s. */
export const WARNING_SPEED = 0.3;

export type StopPhase = 'running' | 'braking' | 'holding';

/**
 * The robot's safety fields judged on the TRUE geometry: a slow-down (warning) field, a protective
 * field that brakes the robot after its reaction time, and contact. It only writes events and
 * tells the run loop to brake; the robot's own belief plays no part, just as a safety scanner's
 * fields do not depend on localization.
 */
export class SafetyMonitor {
  phase: StopPhase = 'running';
  stopCount = 0;
  private isInWarning = false;
  private hasContact = false;
  private previousClearance = Number.POSITIVE_INFINITY;
  private brakeAt = 0;
  private holdUntil = 0;
  relocalizeOnResume = false;

  constructor(
    private readonly reactionTime: number,
    private readonly holdSeconds: number,
    private readonly events: ScriptedEvent[],
  ) {}

  get speedLimit(): number {
    return this.isInWarning ? WARNING_SPEED : Number.POSITIVE_INFINITY;
  }

  /** True once the reaction time has passed and the drives should decelerate. */
  isBrakeApplied(t: number): boolean {
    return this.phase !== 'running' && t >= this.brakeAt;
  }

  /** Starts a protective stop now (bumper or protective field). */
  triggerStop(t: number, detail: string, relocalizeOnResume: boolean): void {
    if (this.phase !== 'running') return;
    this.phase = 'braking';
    this.stopCount++;
    this.brakeAt = t + this.reactionTime;
    this.relocalizeOnResume = relocalizeOnResume;
    this.events.push({ t, kind: 'protective_stop', detail });
  }

  /** Judges the fields on the true clearance (m) after a step of `dt` s; `side` says where the obstacle is. */
  observe(t: number, dt: number, clearance: number, side: string): void {
    if (!this.isInWarning && clearance < WARNING_CLEARANCE) {
      this.isInWarning = true;
      this.events.push({
        t,
        kind: 'warning_field',
        detail: `obstacle entered slow-down field (${side}); clearance ${clearance.toFixed(2)} m`,
      });
    } else if (this.isInWarning && clearance > WARNING_RELEASE) {
      this.isInWarning = false;
    }
    const closingSpeed = (this.previousClearance - clearance) / dt;
    if (clearance < PROTECTIVE_CLEARANCE && closingSpeed > PROTECTIVE_CLOSING_SPEED) {
      this.triggerStop(t, `protective field violated (${side}); clearance ${clearance.toFixed(2)} m`, true);
    }
    this.previousClearance = clearance;
  }

  /** The footprint touched a fixed structure: logged once per run, and the bumper stops the drives. */
  registerContact(t: number, side: string): void {
    if (!this.hasContact) {
      this.hasContact = true;
      this.events.push({ t, kind: 'contact', detail: `bumper contact (${side}) with fixed structure` });
    }
    this.triggerStop(t, `bumper pressed (${side}); drives halted`, true);
  }

  /** Called each step with the current speed; returns true when the hold ends and the robot may go. */
  advance(t: number, speed: number): boolean {
    if (this.phase === 'braking' && speed === 0 && t >= this.brakeAt) {
      this.phase = 'holding';
      this.holdUntil = t + this.holdSeconds;
    }
    if (this.phase === 'holding' && t >= this.holdUntil) {
      this.phase = 'running';
      return true;
    }
    return false;
  }
}
