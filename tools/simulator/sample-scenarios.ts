import type { RobotInfo } from '../../shared/bundle/types';
import type { ScenarioSpec, Waypoints } from './scenario-types';

/** Aisle centre lines of the invented site (m, map frame); see site-layout.ts. */
export const AISLE_1 = 6.3;
export const AISLE_2 = 10.1;
export const AISLE_3 = 13.9;
export const WEST_LANE = 4.5;
export const EAST_LANE = 28.0;
export const CROSS_AISLE = 17.0;

export function tugger(id: string): RobotInfo {
  return {
    id,
    model: 'Saltmarsh Dynamics SM-220 tote tugger',
    footprint: { shape: 'circle', radius: 0.35 },
    max_speed: 1.2,
    max_decel: 1.2,
    reaction_time: 0.25,
  };
}

/** The regular picking loop: up the west lane, east along aisle 1, back west along aisle 2. */
export const PICKING_LOOP: Waypoints = [
  [WEST_LANE, AISLE_1],
  [EAST_LANE, AISLE_1],
  [EAST_LANE, AISLE_2],
  [WEST_LANE + 0.5, AISLE_2],
  [WEST_LANE, AISLE_3],
  [EAST_LANE, AISLE_3],
  [EAST_LANE, AISLE_1 - 0.4],
  [WEST_LANE, AISLE_1 - 0.4],
];

export const HEALTHY_SHIFT: ScenarioSpec = {
  name: 'healthy-shift',
  story: "AMR-07 'Tern' runs its morning picking loop on a dry floor; nothing goes wrong.",
  seed: 1107,
  duration: 80,
  robot: tugger("AMR-07 'Tern'"),
  startTime: '2026-11-14T06:02:00Z',
  start: { x: 3.0, y: 2.0, theta: Math.PI / 2 },
  route: PICKING_LOOP.slice(0, 5),
  world: {},
  stopNotes: [],
  scriptedEvents: [
    { t: 0.5, kind: 'operator_note', detail: 'Shift start; loop P2 released by Ines Marwood; floor dry' },
    { t: 41.2, kind: 'dock_door', detail: 'Dock door DK-3 opened for a chilled trailer' },
    { t: 78.0, kind: 'operator_note', detail: 'Loop P2 first pass complete; no remarks (I. Marwood)' },
  ],
};

export const WHEEL_SLIP: ScenarioSpec = {
  name: 'wheel-slip',
  story:
    "AMR-11 'Plover' crosses a wet patch by a leaking defrost drain in aisle 2; the left wheel spins and its heading goes wrong.",
  seed: 2211,
  duration: 70,
  robot: tugger("AMR-11 'Plover'"),
  startTime: '2026-11-16T13:47:30Z',
  start: { x: 4.0, y: 3.0, theta: Math.PI / 2 },
  route: [
    [WEST_LANE, AISLE_2],
    [EAST_LANE, AISLE_2],
    [EAST_LANE, AISLE_3],
    [WEST_LANE, AISLE_3],
  ],
  world: {},
  slip: { start: 18.0, end: 22.0, yawRate: 0.16 },
  stopNotes: ['Re-localized at aisle 2 by Dario Kessler; wet floor by drain D-4 coned off'],
  scriptedEvents: [
    { t: 2.0, kind: 'operator_note', detail: 'Defrost cycle running in chamber 2 (facilities ticket 5521)' },
  ],
};

export const MOVED_RACK: ScenarioSpec = {
  name: 'moved-rack',
  story:
    "A forklift shunted rack row B's east block 1.2 m west overnight; AMR-03 'Gannet' still trusts the old map at the cross aisle.",
  seed: 3303,
  duration: 75,
  robot: tugger("AMR-03 'Gannet'"),
  startTime: '2026-11-18T05:31:10Z',
  start: { x: 3.5, y: 2.5, theta: Math.PI / 2 },
  route: [
    [WEST_LANE, AISLE_1],
    [CROSS_AISLE, AISLE_1],
    [CROSS_AISLE, AISLE_3],
    [EAST_LANE, AISLE_3],
  ],
  world: { movedRack: { row: 1, shiftX: -1.2 } },
  onboardOffset: { start: 21.0, rampSeconds: 2.5, offset: { x: 0.55, y: 0.05, theta: 0.04 } },
  rerouteAfterStop: [
    [CROSS_AISLE - 0.4, AISLE_1],
    [12.0, AISLE_1],
    [WEST_LANE, AISLE_1 + 0.3],
    [WEST_LANE, AISLE_2],
    [15.0, AISLE_2],
  ],
  stopNotes: [
    'Rack row B east block found 1.2 m west of its mapped place; re-localized and sent round by the west lane (Priya Oduya)',
  ],
  scriptedEvents: [
    {
      t: 1.0,
      kind: 'operator_note',
      detail: 'Night shift reported a forklift bump near rack row B; not yet inspected',
    },
  ],
};

export const PUSHED_ASIDE: ScenarioSpec = {
  name: 'pushed-aside',
  story:
    "A reversing reach truck nudges AMR-09 'Skua' 0.7 m sideways in aisle 3; its odometry sees nothing and it carries on off its line.",
  seed: 4409,
  duration: 70,
  robot: tugger("AMR-09 'Skua'"),
  startTime: '2026-11-19T22:15:45Z',
  start: { x: 4.5, y: 8.0, theta: Math.PI / 2 },
  route: [
    [WEST_LANE, AISLE_3],
    [EAST_LANE, AISLE_3],
    [EAST_LANE, AISLE_2],
    [WEST_LANE + 0.5, AISLE_2],
  ],
  world: {},
  push: {
    start: 22.0,
    duration: 0.6,
    lateral: 0.7,
    rotation: 0.22,
    detail: 'bumper contact rear left: reversing reach truck RT-2 (driver Tomasz Reyes)',
  },
  stopNotes: [
    'Bumper reset and robot re-localized by Lena Haugland after RT-2 incident; driver statement taken',
  ],
  scriptedEvents: [],
};

export const DEGRADED_SENSOR: ScenarioSpec = {
  name: 'degraded-sensor',
  story:
    "AMR-05 'Petrel' leaves the -25 °C freezer chamber; its scanner window fogs over and most returns vanish for 10 s.",
  seed: 5505,
  duration: 75,
  robot: tugger("AMR-05 'Petrel'"),
  startTime: '2026-11-21T10:04:20Z',
  start: { x: 28.0, y: 2.2, theta: Math.PI / 2 },
  route: [
    [EAST_LANE, AISLE_2],
    [WEST_LANE, AISLE_2],
    [WEST_LANE, AISLE_3],
    [EAST_LANE - 4, AISLE_3],
  ],
  world: {},
  degradedLaser: {
    start: 16.0,
    end: 26.0,
    noise: { rangeSigma: 0.35, dropoutRate: 0.85, shortReturnRate: 0.08 },
  },
  onboardOffset: { start: 17.0, rampSeconds: 3.0, offset: { x: 0.2, y: 0.95, theta: -0.1 } },
  stopNotes: ['Scanner window wiped and robot re-localized by Ines Marwood; heater fault logged'],
  scriptedEvents: [
    {
      t: 15.0,
      kind: 'operator_note',
      detail: 'Freezer chamber door FZ-1 cycled; heavy condensation at the threshold',
    },
  ],
};

export const SAMPLE_SCENARIOS: readonly ScenarioSpec[] = [
  HEALTHY_SHIFT,
  WHEEL_SLIP,
  MOVED_RACK,
  PUSHED_ASIDE,
  DEGRADED_SENSOR,
];
