import type { Pose } from './pose-math';
import type { RandomSource } from './random-source';
import { castRay } from './ray-cast';
import type { SimGrid } from './sim-grid';

/** Scan geometry as in the manifest's `scan` block (m, rad). */
export interface ScanGeometry {
  mount: [number, number, number];
  angle_min: number;
  angle_increment: number;
  beams: number;
  range_min: number;
  range_max: number;
}

/** How the laser misbehaves; a degraded sensor raises these. */
export interface LaserNoise {
  /** Standard deviation of the range error, m. */
  rangeSigma: number;
  /** Probability that a beam returns nothing. */
  dropoutRate: number;
  /** Probability of a short spurious return (dust, a passing leg), uniform before the true hit. */
  shortReturnRate: number;
  /**
   * Beams first..last (indices) misbehave whatever they look at: a frosted or dirty part of the
   * window returning short ranges uniform in `short` (m), or, without `short`, returning nothing.
   */
  sector?: { first: number; last: number; short?: readonly [number, number] };
}

export const HEALTHY_LASER: LaserNoise = { rangeSigma: 0.02, dropoutRate: 0.01, shortReturnRate: 0.005 };

/** The sensor's pose in the map frame for a robot pose in the map frame. */
export function sensorPose(robot: Pose, mount: readonly [number, number, number]): Pose {
  const cos = Math.cos(robot.theta);
  const sin = Math.sin(robot.theta);
  return {
    x: robot.x + cos * mount[0] - sin * mount[1],
    y: robot.y + sin * mount[0] + cos * mount[1],
    theta: robot.theta + mount[2],
  };
}

/**
 * Noise-free ranges (m) of every beam from a robot pose on a grid; `Infinity` where nothing lies
 * within `range_max`. Beam k leaves the sensor at angle_min + k * angle_increment (sensor frame).
 */
export function castScan(grid: SimGrid, robot: Pose, geometry: ScanGeometry): Float64Array {
  const sensor = sensorPose(robot, geometry.mount);
  const ranges = new Float64Array(geometry.beams);
  for (let k = 0; k < geometry.beams; k++) {
    const angle = sensor.theta + geometry.angle_min + k * geometry.angle_increment;
    ranges[k] = castRay(grid, sensor.x, sensor.y, angle, geometry.range_max);
  }
  return ranges;
}

/**
 * One recorded scan: true ranges plus Gaussian range noise, dropouts and short returns.
 * Returns `null` for no return (beyond range_max, or dropped), as scans.ndjson stores it.
 */
export function simulateScan(
  trueRanges: Float64Array,
  geometry: ScanGeometry,
  noise: LaserNoise,
  random: RandomSource,
): (number | null)[] {
  const measured: (number | null)[] = new Array(trueRanges.length);
  for (let k = 0; k < trueRanges.length; k++) {
    const truth = trueRanges[k];
    const sector = noise.sector;
    if (sector && k >= sector.first && k <= sector.last) {
      measured[k] = sector.short ? random.uniformBetween(sector.short[0], sector.short[1]) : null;
      continue;
    }
    if (!Number.isFinite(truth) || random.chance(noise.dropoutRate)) {
      measured[k] = null;
      continue;
    }
    let range = random.chance(noise.shortReturnRate)
      ? random.uniformBetween(geometry.range_min, truth)
      : truth + noise.rangeSigma * random.standardNormal();
    range = Math.max(geometry.range_min, range);
    measured[k] = range > geometry.range_max ? null : range;
  }
  return measured;
}
