/**
 * Scenarios none of the committed samples has, for checking the probable causes on incidents the
 * thresholds were not chosen on (docs/causes.md): people walking across the aisles near the robot
 * (no fault), an encoder scale error of a few percent (a gradual odometry fault), and a sensor
 * whose fixed sector of beams returns short ranges or nothing. Generated in
 * memory by the tests, not committed.
 */

import { HEALTHY_LASER, type LaserNoise } from './laser-scanner';
import { AISLE_2, AISLE_3, HEALTHY_SHIFT, PICKING_LOOP, tugger, WEST_LANE } from './sample-scenarios';
import type { ScenarioSpec } from './scenario-types';

/** An adult's shoulder width, m (common practice for a person-sized obstacle). */
const PERSON = 0.45;
/** Walking pace, m/s (about 1.2-1.4 m/s for adults, common practice; slower between racks). */
const WALK = 1.0;

export const PEOPLE_WALKING: ScenarioSpec = {
  ...HEALTHY_SHIFT,
  name: 'people-walking',
  story:
    "AMR-08 'Knot' runs the picking loop while pickers walk up and down beside its route; nothing goes wrong.",
  seed: 8108,
  robot: tugger("AMR-08 'Knot'"),
  route: PICKING_LOOP.slice(0, 5),
  people: [
    { from: [WEST_LANE - 1.2, 4], to: [WEST_LANE - 1.2, 12], speed: WALK, size: PERSON },
    { from: [8, AISLE_2 + 0.9], to: [20, AISLE_2 + 0.9], speed: WALK, size: PERSON },
    { from: [22, AISLE_3 - 0.9], to: [12, AISLE_3 - 0.9], speed: WALK, size: PERSON },
  ],
  scriptedEvents: [
    { t: 0.5, kind: 'operator_note', detail: 'Peak picking hour; three pickers in aisles 1-3' },
  ],
};

export const ENCODER_SCALE: ScenarioSpec = {
  ...HEALTHY_SHIFT,
  name: 'encoder-scale',
  story:
    "AMR-12 'Sora' had a drive wheel replaced with a larger tyre; its odometry reads 4 % long from then on.",
  seed: 1212,
  robot: tugger("AMR-12 'Sora'"),
  route: PICKING_LOOP.slice(0, 5),
  encoderScale: { start: 10, end: 80, factor: 1.04 },
  scriptedEvents: [
    { t: 0.5, kind: 'operator_note', detail: 'First run after drive wheel swap (work order 7730)' },
  ],
};

/** A sensor fault over a fixed sector of beams, for 10 s from 20 s, on the healthy loop. */
function sectorFault(name: string, story: string, seed: number, sector: LaserNoise['sector']): ScenarioSpec {
  return {
    ...HEALTHY_SHIFT,
    name,
    story,
    seed,
    robot: tugger("AMR-06 'Tystie'"),
    route: PICKING_LOOP.slice(0, 5),
    degradedLaser: { start: 20, end: 30, noise: { ...HEALTHY_LASER, sector } },
    scriptedEvents: [{ t: 0.5, kind: 'operator_note', detail: 'Run straight out of the blast freezer' }],
  };
}

/** 40 % of the beams (108 of 271, the right-hand side) return 0.2-0.6 m: frost on part of the window. */
export const FROSTED_WINDOW = sectorFault(
  'frosted-window',
  'Frost forms over the right half of the scanner window; those beams return 0.2-0.6 m for 10 s.',
  6106,
  { first: 0, last: 107, short: [0.2, 0.6] },
);

/** 60 % of the beams (163 of 271) return nothing: a loose cable to part of the sensor head. */
export const LOST_SECTOR = sectorFault(
  'lost-sector',
  'A loose connector blanks 60 % of the scanner sector (no returns) for 10 s.',
  6206,
  { first: 0, last: 162 },
);

export const CAUSE_SCENARIOS: readonly ScenarioSpec[] = [
  PEOPLE_WALKING,
  ENCODER_SCALE,
  FROSTED_WINDOW,
  LOST_SECTOR,
];
