import type { FilterConfig, Footprint, Landmark } from '../bundle/types';

/**
 * `GET /api/bundles/:id/map`: the bundle's map.json as recorded (rows use "." free, "#" occupied,
 * "?" unknown; row 0 is the northmost) plus the robot footprint and laser mount from the manifest.
 */
export interface TBundleMap {
  /** m per cell */
  resolution: number;
  /** Map-frame position of the grid's south-west corner, m. */
  origin: [number, number];
  width: number;
  height: number;
  /** null for a landmark-only map. */
  rows: string[] | null;
  landmarks: Landmark[];
  footprint: Footprint;
  /** Laser pose [x, y, theta] in the robot frame (m, m, rad), when the bundle has scans. */
  scanMount: [number, number, number] | null;
}

/** A pose track in the map frame: t in s since start_time, x/y in m, theta in rad. */
export interface TPoseTrack {
  t: number[];
  x: number[];
  y: number[];
  theta: number[];
}

/**
 * `GET /api/bundles/:id/tracks`: the small tables the timeline and map overlay need, as compact
 * JSON (column arrays): events, onboard and reference poses, odometry speed, commanded speed.
 */
export interface TBundleTracks {
  startTime: string;
  events: { t: number; kind: string; detail: string }[];
  onboard: TPoseTrack | null;
  reference: TPoseTrack | null;
  /** m/s from consecutive odometry readings, stamped at the later reading. */
  speed: { t: number[]; speed: number[] };
  /** Commanded linear velocity, m/s. */
  commands: { t: number[]; v: number[] } | null;
  /** The manifest's filter block: what a replay without overrides uses (the launcher's defaults). */
  filter: FilterConfig;
  /** Beams per scan of the bundle's scanner (the most a replay may use), or null without scans. */
  scanBeams: number | null;
}

/**
 * `GET /api/bundles/:id/replays/:replayId/clearance`: per replay step, the distance (m) from the
 * robot footprint's edge to the nearest occupied map cell at the weighted mean pose; null off the grid.
 */
export interface TReplayClearance {
  /** m subtracted from the centre distance: circle radius or rectangle half-width. */
  footprintReach: number;
  clearance: (number | null)[];
}
