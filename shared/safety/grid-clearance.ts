/**
 * Footprint-to-map clearance: distance (m) from the robot's footprint, placed and oriented by a
 * pose, to the nearest occupied cell of the occupancy grid, each cell taken as its full square.
 * A distance transform of the occupied cell centres bounds the search, so only the cells that can
 * be nearest are measured exactly.
 */
import type { Footprint, OccupancyGrid } from '../bundle/types';
import { CELL_OCCUPIED } from '../bundle/types';
import { FAR, squaredDistanceTransform } from '../engine/distance-transform';
import { cos, sin } from '../engine/numerics';
import {
  circumscribedRadius,
  convexPolygonDistance,
  inscribedRadius,
  rectangleCorners,
} from './footprint-geometry';

/** Beyond this distance (m) from the pose the clearance is bounded from the transform instead of measured cell by cell. */
export const EXACT_SEARCH_RADIUS = 3;

export interface ObstacleField {
  grid: OccupancyGrid;
  /** Squared distance, in cells^2, from each cell centre to the nearest occupied cell centre (map row order). */
  squared: Float64Array;
  hasObstacles: boolean;
}

export function buildObstacleField(grid: OccupancyGrid): ObstacleField {
  const occupied = new Uint8Array(grid.cells.length);
  let any = false;
  for (let c = 0; c < occupied.length; c++) {
    occupied[c] = grid.cells[c] === CELL_OCCUPIED ? 1 : 0;
    if (occupied[c]) any = true;
  }
  return { grid, squared: squaredDistanceTransform(occupied, grid.width, grid.height), hasObstacles: any };
}

/** Distance (m) from point (px, py) to the square of cell (i, j). */
function pointToCell(grid: OccupancyGrid, px: number, py: number, i: number, j: number): number {
  const x0 = grid.origin[0] + j * grid.resolution;
  const y0 = grid.origin[1] + (grid.height - 1 - i) * grid.resolution;
  const dx = Math.max(x0 - px, 0, px - (x0 + grid.resolution));
  const dy = Math.max(y0 - py, 0, py - (y0 + grid.resolution));
  return Math.sqrt(dx * dx + dy * dy);
}

function cellSquare(grid: OccupancyGrid, i: number, j: number, out: Float64Array): Float64Array {
  const x0 = grid.origin[0] + j * grid.resolution;
  const y0 = grid.origin[1] + (grid.height - 1 - i) * grid.resolution;
  const r = grid.resolution;
  out[0] = x0;
  out[1] = y0;
  out[2] = x0 + r;
  out[3] = y0;
  out[4] = x0 + r;
  out[5] = y0 + r;
  out[6] = x0;
  out[7] = y0 + r;
  return out;
}

/**
 * Clearance (m) from the footprint at pose (x, y, theta) to the nearest occupied cell; 0 when it
 * touches or overlaps one. null when the pose is not finite or off the grid, or the grid has no
 * occupied cell. Exact within EXACT_SEARCH_RADIUS of the pose; further out a lower bound within
 * one cell diagonal plus the footprint's circumscribed radius.
 */
export function footprintToGrid(
  field: ObstacleField,
  footprint: Footprint,
  x: number,
  y: number,
  theta: number,
): number | null {
  const { grid } = field;
  if (!field.hasObstacles || !Number.isFinite(x) || !Number.isFinite(y) || !Number.isFinite(theta))
    return null;
  const res = grid.resolution;
  const j0 = Math.floor((x - grid.origin[0]) / res);
  const i0 = grid.height - 1 - Math.floor((y - grid.origin[1]) / res);
  if (i0 < 0 || j0 < 0 || i0 >= grid.height || j0 >= grid.width) return null;
  const squared = field.squared[i0 * grid.width + j0];
  if (squared >= FAR) return null;
  // Nearest occupied square to the pose point: within a cell diagonal of the centre-to-centre distance.
  const centreDistance = Math.sqrt(squared) * res;
  const outer = circumscribedRadius(footprint);
  const searchReach = centreDistance + res * Math.SQRT2 + outer + res;
  if (centreDistance > EXACT_SEARCH_RADIUS) return Math.max(0, centreDistance - res * Math.SQRT2 - outer);
  const span = Math.ceil(searchReach / res);
  let best = Number.POSITIVE_INFINITY;
  const isCircle = footprint.shape === 'circle';
  const corners = isCircle ? undefined : rectangleCorners(footprint, x, y, cos(theta), sin(theta));
  const square = new Float64Array(8);
  const inner = inscribedRadius(footprint);
  for (let i = Math.max(0, i0 - span); i <= Math.min(grid.height - 1, i0 + span); i++) {
    for (let j = Math.max(0, j0 - span); j <= Math.min(grid.width - 1, j0 + span); j++) {
      if (grid.cells[i * grid.width + j] !== CELL_OCCUPIED) continue;
      const toCentre = pointToCell(grid, x, y, i, j);
      if (toCentre - outer >= best) continue;
      const d = isCircle
        ? Math.max(0, toCentre - footprint.radius)
        : toCentre <= inner
          ? 0
          : convexPolygonDistance(corners!, cellSquare(grid, i, j, square));
      if (d < best) best = d;
      if (best === 0) return 0;
    }
  }
  return Number.isFinite(best) ? best : null;
}

/** True when the footprint at the pose touches or overlaps an occupied cell (cheap bounds first). */
export function footprintHitsGrid(
  field: ObstacleField,
  footprint: Footprint,
  x: number,
  y: number,
  theta: number,
): boolean {
  const { grid } = field;
  if (!field.hasObstacles) return false;
  const res = grid.resolution;
  const j0 = Math.floor((x - grid.origin[0]) / res);
  const i0 = grid.height - 1 - Math.floor((y - grid.origin[1]) / res);
  if (i0 < 0 || j0 < 0 || i0 >= grid.height || j0 >= grid.width) return false;
  const centreDistance = Math.sqrt(field.squared[i0 * grid.width + j0]) * res;
  if (centreDistance - 2 * res * Math.SQRT2 > circumscribedRadius(footprint)) return false;
  if (centreDistance + res * Math.SQRT2 <= inscribedRadius(footprint)) return true;
  return footprintToGrid(field, footprint, x, y, theta) === 0;
}
