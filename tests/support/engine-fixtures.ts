/**
 * Synthetic incident bundles for engine tests and the benchmark: an invented warehouse
 * ("Harbourline test hall", 40 m x 20 m) with a perimeter wall, a long central rack, low shelving
 * along the south wall and pillars; a robot driving an elliptical loop at about 1 m/s; odometry
 * corrupted per the odometry motion model; sphere-traced laser scans; reflector detections; a
 * reference trajectory and an onboard estimate with covariance. Deterministic for a given seed.
 */
import type { Bundle, DetectorConfig, Landmark, Manifest, OccupancyGrid } from '../../shared/bundle/types';
import { CELL_FREE, CELL_OCCUPIED } from '../../shared/bundle/types';
import { FAR, squaredDistanceTransform } from '../../shared/engine/distance-transform';
import { decomposeOdometry } from '../../shared/engine/motion-model';
import { createRandomScratch, fillNormals, fillUniforms } from '../../shared/engine/random';
import { wrapAngle } from '../../shared/engine/stats';

export interface SyntheticBundleOptions {
  /** Duration, s */
  seconds: number;
  /** Odometry and scan rate, Hz */
  rate?: number;
  particles?: number;
  beamsUsed?: number;
  seed?: number;
  /** Include detections of the reflector landmarks (every 0.5 s). */
  withDetections?: boolean;
  /**
   * Landmark-rich site: 39 landmarks (reflectors every few metres along the walls, racks and
   * pillars) detected at every step within 5 m, about five detections per step.
   */
  landmarkRich?: boolean;
  /** Onboard estimate and reference trajectory. */
  withPoses?: boolean;
}

const WIDTH_M = 40;
const HEIGHT_M = 20;
const RESOLUTION = 0.05;
const LOOP = { cx: 20, cy: 10, ax: 15, ay: 7, speed: 1 };

function buildWarehouseGrid(): OccupancyGrid {
  const width = Math.round(WIDTH_M / RESOLUTION);
  const height = Math.round(HEIGHT_M / RESOLUTION);
  const cells = new Uint8Array(width * height).fill(CELL_FREE);
  const fill = (x0: number, y0: number, x1: number, y1: number) => {
    for (let j = Math.floor(x0 / RESOLUTION); j < Math.ceil(x1 / RESOLUTION); j++) {
      for (let r = Math.floor(y0 / RESOLUTION); r < Math.ceil(y1 / RESOLUTION); r++) {
        cells[(height - 1 - r) * width + j] = CELL_OCCUPIED;
      }
    }
  };
  fill(0, 0, WIDTH_M, 0.2);
  fill(0, HEIGHT_M - 0.2, WIDTH_M, HEIGHT_M);
  fill(0, 0, 0.2, HEIGHT_M);
  fill(WIDTH_M - 0.2, 0, WIDTH_M, HEIGHT_M);
  fill(11, 9.4, 29, 10.6);
  fill(6, 0.6, 34, 1.4);
  for (const [px, py] of [
    [8, 16],
    [16, 18.6],
    [24, 18.6],
    [32, 16],
    [37.5, 10],
    [2.5, 10],
  ]) {
    fill(px - 0.3, py - 0.3, px + 0.3, py + 0.3);
  }
  return { resolution: RESOLUTION, width, height, origin: [0, 0], cells };
}

const LANDMARKS: Landmark[] = [
  [5, 5],
  [10, 3],
  [20, 2.2],
  [30, 3],
  [35, 5],
  [36, 15],
  [28, 17.5],
  [20, 18],
  [12, 17.5],
  [4, 15],
  [12, 9.2],
  [28, 10.8],
].map(([x, y], k) => ({ id: `HL-${k + 1}`, class: k % 4 === 3 ? 'column' : 'reflector', x, y }));

/** 39 landmarks: 26 along the walls, 9 on the central rack and shelving, 4 columns on pillars. */
const RICH_LANDMARKS: Landmark[] = [
  ...[3, 7.5, 12, 16.5, 21, 25.5, 30, 34.5, 38].flatMap((x) => [
    [x, 0.25],
    [x, 19.75],
  ]),
  ...[4, 10, 16].flatMap((y) => [
    [0.25, y],
    [39.75, y],
  ]),
  [12, 9.35],
  [16, 9.35],
  [20, 9.35],
  [24, 9.35],
  [28, 9.35],
  [14, 10.65],
  [22, 10.65],
  [26, 10.65],
  [18, 1.45],
  [18, 10.65],
  [30, 1.45],
  [8, 16.35],
  [32, 16.35],
  [37.5, 10.35],
  [2.5, 10.35],
].map(([x, y], k) => ({
  id: `HR-${k + 1}`,
  class: k >= 35 ? 'column' : k % 7 === 6 ? 'dock' : 'reflector',
  x,
  y,
}));
const RICH_DETECTION_RANGE = 7.25;

/** True pose on the loop after `s` metres (map frame): heading along the tangent, counter-clockwise. */
function loopPose(time: number): [number, number, number] {
  const angle = (time * LOOP.speed) / ((LOOP.ax + LOOP.ay) / 2) - Math.PI / 2;
  const x = LOOP.cx + LOOP.ax * Math.cos(angle);
  const y = LOOP.cy + LOOP.ay * Math.sin(angle);
  return [x, y, Math.atan2(LOOP.ay * Math.cos(angle), -LOOP.ax * Math.sin(angle))];
}

/** Detector of the synthetic robot: three classes, mild confusion, 5 % clutter. */
export const WAREHOUSE_DETECTOR: DetectorConfig = {
  classes: ['reflector', 'dock', 'column'],
  confusion: [
    [0.9, 0.05, 0.05],
    [0.1, 0.85, 0.05],
    [0.05, 0.05, 0.9],
  ],
  range_sigma: 0.05,
  bearing_sigma: 0.03,
  max_range: 8,
  clutter: 0.05,
};

function manifestFor(options: Required<SyntheticBundleOptions>): Manifest {
  const start = loopPose(0);
  return {
    format: 'incident-bundle/1',
    robot: {
      id: 'HL-AMR-03',
      model: 'Tern 400',
      footprint: { shape: 'circle', radius: 0.35 },
      max_speed: 1.5,
      max_decel: 1.2,
      reaction_time: 0.25,
    },
    site: 'Harbourline test hall',
    start_time: '2026-11-14T09:12:00Z',
    scan: {
      mount: [0.2, 0, 0],
      angle_min: -2.35619,
      angle_increment: 4.71238 / 270,
      beams: 271,
      range_min: 0.05,
      range_max: 12,
    },
    detector: WAREHOUSE_DETECTOR,
    filter: {
      particles: options.particles,
      seed: 7,
      motion: { model: 'odometry', alpha: [0.02, 0.005, 0.02, 0.005] },
      scan_model: {
        model: 'likelihood_field',
        z_hit: 0.9,
        z_rand: 0.1,
        sigma_hit: 0.1,
        beams_used: options.beamsUsed,
      },
      resampling: { method: 'systematic', threshold: 0.5 },
      initial: { mode: 'pose', x: start[0], y: start[1], theta: start[2], sigma_xy: 0.2, sigma_theta: 0.1 },
    },
  };
}

/** Distance (m) from each cell to the nearest occupied cell, south-up rows, for sphere tracing. */
function distanceField(grid: OccupancyGrid): Float64Array {
  const { width, height } = grid;
  const occupied = new Uint8Array(width * height);
  for (let i = 0; i < height; i++)
    for (let j = 0; j < width; j++) occupied[(height - 1 - i) * width + j] = grid.cells[i * width + j];
  const squared = squaredDistanceTransform(occupied, width, height);
  return squared.map((d) => (d >= FAR ? 1e9 : Math.sqrt(d) * RESOLUTION));
}

function castRay(
  distance: Float64Array,
  grid: OccupancyGrid,
  x: number,
  y: number,
  angle: number,
  rangeMax: number,
): number {
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  let travelled = 0;
  while (travelled < rangeMax) {
    const column = Math.floor((x + travelled * c) / RESOLUTION);
    const row = Math.floor((y + travelled * s) / RESOLUTION);
    if (column < 0 || column >= grid.width || row < 0 || row >= grid.height) return Number.NaN;
    const clearance = distance[row * grid.width + column];
    if (clearance < RESOLUTION * 0.75) return travelled;
    travelled += clearance - RESOLUTION * 0.5;
  }
  return Number.NaN;
}

/** Builds a synthetic bundle; see the file comment. */
export function makeSyntheticBundle(input: SyntheticBundleOptions): Bundle {
  const options: Required<SyntheticBundleOptions> = {
    rate: 10,
    particles: 500,
    beamsUsed: 60,
    seed: 11,
    withDetections: true,
    withPoses: true,
    landmarkRich: false,
    ...input,
  };
  const landmarks = options.landmarkRich ? RICH_LANDMARKS : LANDMARKS;
  const manifest = manifestFor(options);
  const scanConfig = manifest.scan!;
  const grid = buildWarehouseGrid();
  const distance = distanceField(grid);
  const steps = Math.round(options.seconds * options.rate) + 1;
  const random = createRandomScratch();
  const noise = random.values;
  const t = new Float64Array(steps);
  const odometry = {
    t,
    x: new Float64Array(steps),
    y: new Float64Array(steps),
    theta: new Float64Array(steps),
  };
  const truth = { t, x: new Float64Array(steps), y: new Float64Array(steps), theta: new Float64Array(steps) };
  const ranges = new Float32Array(steps * scanConfig.beams);
  const detections: { t: number; classIndex: number; range: number; bearing: number }[] = [];
  for (let k = 0; k < steps; k++) {
    t[k] = k / options.rate;
    [truth.x[k], truth.y[k], truth.theta[k]] = loopPose(t[k]);
    if (k > 0) {
      const inc = decomposeOdometry(
        truth.x[k - 1],
        truth.y[k - 1],
        truth.theta[k - 1],
        truth.x[k],
        truth.y[k],
        truth.theta[k],
      );
      fillNormals(options.seed, 90, k, 0, 0, random);
      const rot1 = inc.rot1 + 0.01 * Math.abs(inc.rot1) * noise[0];
      const trans = inc.trans * (1 + 0.01 * noise[1]);
      const rot2 = inc.rot2 + 0.01 * Math.abs(inc.rot2) * noise[2];
      odometry.x[k] = odometry.x[k - 1] + trans * Math.cos(odometry.theta[k - 1] + rot1);
      odometry.y[k] = odometry.y[k - 1] + trans * Math.sin(odometry.theta[k - 1] + rot1);
      odometry.theta[k] = wrapAngle(odometry.theta[k - 1] + rot1 + rot2);
    }
    const sensorX = truth.x[k] + 0.2 * Math.cos(truth.theta[k]);
    const sensorY = truth.y[k] + 0.2 * Math.sin(truth.theta[k]);
    for (let b = 0; b < scanConfig.beams; b += 4) {
      fillNormals(options.seed, 91, k, b, 0, random);
      const normals = [noise[0], noise[1], noise[2], noise[3]];
      fillUniforms(options.seed, 92, k, b, 0, random);
      for (let q = 0; q < 4 && b + q < scanConfig.beams; q++) {
        const angle = truth.theta[k] + scanConfig.angle_min + (b + q) * scanConfig.angle_increment;
        const hit = castRay(distance, grid, sensorX, sensorY, angle, scanConfig.range_max);
        ranges[k * scanConfig.beams + b + q] = noise[q] < 0.01 ? Number.NaN : hit + 0.02 * normals[q];
      }
    }
    const detectionEvery = options.landmarkRich ? 1 : Math.max(1, Math.round(options.rate / 2));
    if (options.withDetections && k % detectionEvery === 0) {
      for (let l = 0; l < landmarks.length; l++) {
        const dx = landmarks[l].x - truth.x[k];
        const dy = landmarks[l].y - truth.y[k];
        const range = Math.hypot(dx, dy);
        if (range > (options.landmarkRich ? RICH_DETECTION_RANGE : 7.5)) continue;
        fillNormals(options.seed, 93, k, l, 0, random);
        detections.push({
          t: t[k],
          classIndex: WAREHOUSE_DETECTOR.classes.indexOf(landmarks[l].class),
          range: range + 0.05 * noise[0],
          bearing: wrapAngle(Math.atan2(dy, dx) - truth.theta[k] + 0.03 * noise[1]),
        });
      }
    }
  }
  const bundle: Bundle = {
    manifest,
    map: {
      resolution: RESOLUTION,
      origin: [0, 0],
      width: grid.width,
      height: grid.height,
      grid,
      landmarks,
    },
    odometry,
    scans: { t: t.slice(), count: steps, beams: scanConfig.beams, ranges },
  };
  if (options.withDetections) {
    bundle.detections = {
      t: Float64Array.from(detections, (d) => d.t),
      classIndex: Int32Array.from(detections, (d) => d.classIndex),
      range: Float64Array.from(detections, (d) => d.range),
      bearing: Float64Array.from(detections, (d) => d.bearing),
    };
  }
  if (options.withPoses) {
    bundle.reference = { ...truth, source: Array.from({ length: steps }, () => 'site camera survey') };
    const offset = (v: Float64Array, by: number) => v.map((value) => value + by);
    const constant = (value: number) => new Float64Array(steps).fill(value);
    bundle.onboard = {
      t,
      x: offset(truth.x, 0.05),
      y: offset(truth.y, -0.03),
      theta: truth.theta.map((v) => wrapAngle(v + 0.01)),
      cov: { xx: constant(0.01), xy: constant(0), yy: constant(0.01), tt: constant(0.001) },
    };
  }
  return bundle;
}
