/**
 * Long healthy runs for measuring flag precision (bench/flag-precision.ts): the picking loop
 * through all three aisles repeated for up to an hour, people standing and pacing beside the
 * route, odometry noise at the high end of normal, and the loop's tight corners. Nothing goes
 * wrong in them, so every warning they raise is a false alarm.
 *
 * Runs with different seeds, people and length: `tuning-loop` is the one thresholds were chosen
 * on, `hour-loop` and `hour-loop-2` only report them (docs/flags.md). Not committed: they are generated
 * into sample-logs/large/ (ignored by git) by `npm run samples -- --long NAME`.
 */
import { AISLE_1, AISLE_3, HEALTHY_SHIFT, PICKING_LOOP, tugger, WEST_LANE } from './sample-scenarios';
import type { ScenarioSpec } from './scenario-types';

/**
 * About 1.6 times the manifest's variance coefficients (TRUE_ODOMETRY_ALPHA): worn tyres on a
 * dusty floor, still within what an ordinary drive calibration tolerates (from-memory judgement).
 */
const HIGH_NORMAL_ALPHA: [number, number, number, number] = [0.08, 0.008, 0.016, 0.0032];
/** An adult's shoulder width, m (common practice for a person-sized obstacle). */
const PERSON = 0.45;

/** The loop repeated often enough to fill `seconds` (a lap takes a little over a minute). */
function loopFor(seconds: number) {
  const laps = Math.ceil(seconds / 60) + 1;
  return Array.from({ length: laps }, () => PICKING_LOOP).flat();
}

function longRun(name: string, seed: number, seconds: number, people: ScenarioSpec['people']): ScenarioSpec {
  return {
    ...HEALTHY_SHIFT,
    name,
    story: `${seconds / 60}-minute picking loop with people beside the route; no fault (precision benchmark)`,
    seed,
    duration: seconds,
    robot: tugger("AMR-14 'Dunlin'"),
    route: loopFor(seconds),
    people,
    odometryAlpha: HIGH_NORMAL_ALPHA,
    scriptedEvents: [],
  };
}

/** Checking run: an hour (36,000 steps); two people stand against the racks, two pace beside the lanes. */
export const HOUR_LOOP = longRun('hour-loop', 7101, 3600, [
  { from: [12.0, 7.3], size: PERSON },
  { from: [22.0, 12.9], size: PERSON },
  { from: [2.5, 3.0], to: [2.5, 17.0], speed: 1.1, size: PERSON },
  { from: [7.0, 2.2], to: [25.0, 2.2], speed: 0.9, size: PERSON },
]);

/** Tuning run: ten minutes, other seed and places (one person stands in aisle 3, one in aisle 1, one paces). */
export const TUNING_LOOP = longRun('tuning-loop', 7202, 600, [
  { from: [24.5, AISLE_3 - 0.95], size: PERSON },
  { from: [10.5, AISLE_1 - 1.0], size: PERSON },
  { from: [WEST_LANE - 2.0, 16.0], to: [WEST_LANE - 2.0, 4.0], speed: 1.3, size: PERSON },
]);

/**
 * Second checking hour, made after hour-loop had been looked at once (docs/flags.md says what
 * changed then): other seed, people elsewhere, so the rule change is checked on unseen data.
 */
export const HOUR_LOOP_2 = longRun('hour-loop-2', 7404, 3600, [
  { from: [20.5, AISLE_1 + 0.95], size: PERSON },
  { from: [14.0, AISLE_3 + 1.0], size: PERSON },
  { from: [WEST_LANE - 2.2, 4.0], to: [WEST_LANE - 2.2, 16.5], speed: 0.8, size: PERSON },
  { from: [26.0, 17.8], to: [8.0, 17.8], speed: 1.2, size: PERSON },
]);

/** Third check, ten minutes, made after hour-loop-2 had been looked at (docs/flags.md). */
export const CHECK_LOOP_3 = longRun('check-loop-3', 7505, 600, [
  { from: [19.0, AISLE_3 - 1.0], size: PERSON },
  { from: [26.0, AISLE_1 + 1.0], size: PERSON },
  { from: [WEST_LANE - 2.0, 15.0], to: [WEST_LANE - 2.0, 3.5], speed: 1.0, size: PERSON },
]);

export const LONG_SCENARIOS: readonly ScenarioSpec[] = [TUNING_LOOP, HOUR_LOOP, HOUR_LOOP_2, CHECK_LOOP_3];
