/**
 * Poses drawn from the landmark measurement model instead of uniformly, the proposal for recovery
 * injection (sensor resetting localization, Lenser & Veloso 2000; mixture MCL sampling from
 * p(z | x), Thrun, Fox, Burgard & Dellaert 2001, "Robust Monte Carlo localization for mobile
 * robots"). An association is picked from the step's table (recovery-proposal.ts), range and
 * bearing noise are drawn from the detector's sigmas, and the pose is solved from the landmarks.
 */

import { CELL_FREE, type DetectionTable, type OccupancyGrid } from '../bundle/types';
import type { FreeSpace } from './free-space';
import type { LandmarkModel } from './landmark-model';
import { atan2, cos, sin } from './numerics';
import type { MeasurementProposal } from './recovery-proposal';
import { wrapAngle } from './stats';

/** Robot-frame point (m) of a detection at `range` (m) and `bearing` (rad). */
export function detectionPoint(range: number, bearing: number): [number, number] {
  return [range * cos(bearing), range * sin(bearing)];
}

/** Index of the first entry whose cumulative weight exceeds u (binary search). */
export function pickEntry(cumulative: Float64Array, count: number, u: number): number {
  let low = 0;
  let high = count - 1;
  while (low < high) {
    const middle = (low + high) >> 1;
    if (cumulative[middle] > u) high = middle;
    else low = middle + 1;
  }
  return low;
}

/**
 * Robot pose (map frame, m and rad) that sees landmark `a` at `range` (m) and `bearing` (rad, robot
 * frame), with the landmark lying along map direction `towardLandmark` (rad) from the robot:
 * heading = towardLandmark - bearing. Written to out[0..2].
 */
export function placeFromSingleDetection(
  model: LandmarkModel,
  a: number,
  range: number,
  bearing: number,
  towardLandmark: number,
  out: Float64Array,
): void {
  out[0] = model.x[a] - range * cos(towardLandmark);
  out[1] = model.y[a] - range * sin(towardLandmark);
  out[2] = wrapAngle(towardLandmark - bearing);
}

/**
 * Robot pose (map frame) that maps robot-frame points p_i = r_i (cos b_i, sin b_i) (m) onto
 * landmarks a and b: the heading turns p_j - p_i onto L_b - L_a, then the position puts p_i on L_a.
 * Written to out[0..2].
 */
export function placeFromDetectionPair(
  model: LandmarkModel,
  a: number,
  b: number,
  rangeI: number,
  bearingI: number,
  rangeJ: number,
  bearingJ: number,
  out: Float64Array,
): void {
  const [xi, yi] = detectionPoint(rangeI, bearingI);
  const [xj, yj] = detectionPoint(rangeJ, bearingJ);
  const heading = wrapAngle(
    atan2(model.y[b] - model.y[a], model.x[b] - model.x[a]) - atan2(yj - yi, xj - xi),
  );
  const c = cos(heading);
  const s = sin(heading);
  out[0] = model.x[a] - (c * xi - s * yi);
  out[1] = model.y[a] - (s * xi + c * yi);
  out[2] = heading;
}

/**
 * Draws one pose (map frame) from the table into out[0..2], from two uniforms in (0, 1) (entry,
 * angle on the circle) and four standard normals: range and bearing noise of detection i, then of
 * detection j for a pair, or the angle around the nearest circle point for a single entry with a prior.
 */
export function drawProposalPose(
  table: MeasurementProposal,
  model: LandmarkModel,
  detections: DetectionTable,
  uEntry: number,
  uAngle: number,
  normals: Float64Array,
  out: Float64Array,
): void {
  const k = pickEntry(table.cumulative, table.count, uEntry);
  const i = table.detectionI[k];
  const rangeI = Math.max(0, detections.range[i] + model.rangeSigma * normals[0]);
  const bearingI = detections.bearing[i] + model.bearingSigma * normals[1];
  if (!table.isPair) {
    const towardLandmark =
      table.angleSigma[k] > 0
        ? table.nearestAngle[k] + table.angleSigma[k] * normals[2]
        : Math.PI * (2 * uAngle - 1);
    placeFromSingleDetection(model, table.landmarkA[k], rangeI, bearingI, towardLandmark, out);
    return;
  }
  const j = table.detectionJ[k];
  const rangeJ = Math.max(0, detections.range[j] + model.rangeSigma * normals[2]);
  const bearingJ = detections.bearing[j] + model.bearingSigma * normals[3];
  placeFromDetectionPair(
    model,
    table.landmarkA[k],
    table.landmarkB[k],
    rangeI,
    bearingI,
    rangeJ,
    bearingJ,
    out,
  );
}

/**
 * Whether (x, y) (map frame, m) lies on a free cell of `grid`; without a grid, inside the map
 * rectangle described by `space`.
 */
export function isFreePosition(
  grid: OccupancyGrid | undefined,
  space: FreeSpace,
  x: number,
  y: number,
): boolean {
  const frame = grid ?? { ...space, origin: [space.originX, space.originY] };
  const column = Math.floor((x - frame.origin[0]) / frame.resolution);
  const rowFromSouth = Math.floor((y - frame.origin[1]) / frame.resolution);
  if (column < 0 || rowFromSouth < 0 || column >= frame.width || rowFromSouth >= frame.height) return false;
  if (!grid) return true;
  return grid.cells[(grid.height - 1 - rowFromSouth) * grid.width + column] === CELL_FREE;
}
