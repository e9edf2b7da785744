/**
 * Likelihood-field range-scan model (Thrun, Burgard, Fox, Probabilistic Robotics, 2005, Table 6.3).
 * A per-cell table of log(z_hit * N(d; 0, sigma_hit) + z_rand / z_max), d = distance (m) from the
 * cell centre to the nearest occupied cell centre, is computed once per map and settings; each
 * beam then costs one table lookup.
 *
 * Internal layout: the tables are row-major with row 0 the SOUTHMOST row (cell (r, c) covers
 * x in [origin_x + c res, +res), y in [origin_y + r res, +res)), so a map-frame point maps to a
 * cell with two multiplications. The bundle's own grid has row 0 northmost; conversion happens here.
 */

import type { OccupancyGrid, ScanConfig, ScanModelConfig } from '../bundle/types';
import { CELL_OCCUPIED } from '../bundle/types';
import { FAR, squaredDistanceTransform } from './distance-transform';
import { cos, log, sin } from './numerics';
import { normalDensity } from './stats';

export interface LikelihoodField {
  width: number;
  height: number;
  /** m per cell */
  resolution: number;
  inverseResolution: number;
  originX: number;
  originY: number;
  /** Per-cell log-likelihood of an endpoint, south-up rows. */
  logLikelihood: Float32Array;
  /** Distance (m) from each cell centre to the nearest occupied cell, south-up rows; Infinity if none. */
  distance: Float32Array;
  /** log(z_rand / z_max) rounded to Float32: the value for endpoints outside the grid or on unknown cells. */
  floorLogLikelihood: number;
  /**
   * `logLikelihood` with a border of `padding` cells of `floorLogLikelihood` on every side
   * ((width + 2 padding) x (height + 2 padding), south-up). The border reaches one sensor range
   * (plus a metre for the mount) past the map, so for a particle inside the map every beam
   * endpoint lands in the table and the hot loop needs no bounds check (see scan-likelihood.ts).
   */
  paddedLogLikelihood: Float32Array;
  /** Border width (cells) of `paddedLogLikelihood`, >= 1. */
  padding: number;
}

/** Extra reach (m) of the padded border beyond range_max, for the sensor mount offset. */
const MOUNT_ALLOWANCE = 1;

function padTable(
  table: Float32Array,
  width: number,
  height: number,
  padding: number,
  border: number,
): Float32Array {
  const paddedWidth = width + 2 * padding;
  const padded = new Float32Array(paddedWidth * (height + 2 * padding)).fill(border);
  for (let row = 0; row < height; row++)
    padded.set(table.subarray(row * width, (row + 1) * width), (row + padding) * paddedWidth + padding);
  return padded;
}

/** Builds the likelihood field for a grid; `rangeMax` (m) is the sensor's z_max. */
export function buildLikelihoodField(
  grid: OccupancyGrid,
  model: ScanModelConfig,
  rangeMax: number,
): LikelihoodField {
  const { width, height, resolution } = grid;
  const occupiedSouthUp = new Uint8Array(width * height);
  for (let i = 0; i < height; i++) {
    const row = height - 1 - i;
    for (let j = 0; j < width; j++)
      occupiedSouthUp[row * width + j] = grid.cells[i * width + j] === CELL_OCCUPIED ? 1 : 0;
  }
  const squared = squaredDistanceTransform(occupiedSouthUp, width, height);
  const padding = Math.ceil((rangeMax + MOUNT_ALLOWANCE) / resolution) + 2;
  const randomTerm = model.z_rand / rangeMax;
  // Rounded to Float32 like every table cell, so an endpoint off the map adds the same value
  // whether it is read from the padded border or substituted by a bounds check.
  const floorLogLikelihood = Math.fround(log(randomTerm));
  const logLikelihood = new Float32Array(width * height);
  const distance = new Float32Array(width * height);
  for (let row = 0; row < height; row++) {
    const mapRow = height - 1 - row;
    for (let j = 0; j < width; j++) {
      const index = row * width + j;
      const d = squared[index] >= FAR ? Number.POSITIVE_INFINITY : Math.sqrt(squared[index]) * resolution;
      distance[index] = d;
      // Unknown cells carry no evidence either way: they get the random-measurement floor.
      const isUnknown = grid.cells[mapRow * width + j] > CELL_OCCUPIED;
      logLikelihood[index] =
        isUnknown || d === Number.POSITIVE_INFINITY
          ? floorLogLikelihood
          : log(model.z_hit * normalDensity(d, 0, model.sigma_hit) + randomTerm);
    }
  }
  return {
    width,
    height,
    resolution,
    inverseResolution: 1 / resolution,
    originX: grid.origin[0],
    originY: grid.origin[1],
    logLikelihood,
    distance,
    floorLogLikelihood,
    paddedLogLikelihood: padTable(logLikelihood, width, height, padding, floorLogLikelihood),
    padding,
  };
}

/**
 * Indices of `used` beams evenly spaced over `total`: round(k (total - 1) / (used - 1)), so the first
 * and last beams are always included; one beam means the middle one.
 */
export function selectEvenlySpacedBeams(total: number, used: number): Int32Array {
  const count = Math.min(total, Math.max(1, used));
  const indices = new Int32Array(count);
  if (count === 1) {
    indices[0] = Math.floor((total - 1) / 2);
    return indices;
  }
  for (let k = 0; k < count; k++) indices[k] = Math.round((k * (total - 1)) / (count - 1));
  return indices;
}

/** Per selected beam, the unit direction in the robot frame (sensor mount rotation applied). */
export interface BeamGeometry {
  indices: Int32Array;
  cos: Float64Array;
  sin: Float64Array;
}

export function buildBeamGeometry(scan: ScanConfig, beamsUsed: number): BeamGeometry {
  const indices = selectEvenlySpacedBeams(scan.beams, beamsUsed);
  const cosines = new Float64Array(indices.length);
  const sines = new Float64Array(indices.length);
  for (let k = 0; k < indices.length; k++) {
    const angle = scan.mount[2] + scan.angle_min + indices[k] * scan.angle_increment;
    cosines[k] = cos(angle);
    sines[k] = sin(angle);
  }
  return { indices, cos: cosines, sin: sines };
}

/**
 * Writes the robot-frame endpoints (m) of the usable selected beams of scan `scanIndex` to
 * `endX`/`endY` and returns how many there are. Skipped: `null` ranges (NaN), readings at or
 * beyond range_max (max-range readings carry no endpoint), and readings below range_min.
 */
export function robotFrameEndpoints(
  ranges: Float32Array,
  scanIndex: number,
  scan: ScanConfig,
  geometry: BeamGeometry,
  endX: Float64Array,
  endY: Float64Array,
): number {
  const base = scanIndex * scan.beams;
  let count = 0;
  for (let k = 0; k < geometry.indices.length; k++) {
    const range = ranges[base + geometry.indices[k]];
    if (!(range >= scan.range_min && range < scan.range_max)) continue;
    endX[count] = scan.mount[0] + range * geometry.cos[k];
    endY[count] = scan.mount[1] + range * geometry.sin[k];
    count++;
  }
  return count;
}

export { accumulateScanLogLikelihood } from './scan-likelihood';
