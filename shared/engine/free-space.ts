/**
 * Uniform pose sampling over the map's free space, used by the global initial belief and by
 * recovery injection.
 */
import type { SiteMap } from '../bundle/types';
import { CELL_FREE } from '../bundle/types';

/** Where uniformly sampled poses may land: the free cells, or the whole map rectangle without a grid. */
export interface FreeSpace {
  /** Indices (i * width + j, map row order: row 0 northmost) of free cells; empty without a grid. */
  cells: Int32Array;
  width: number;
  height: number;
  resolution: number;
  originX: number;
  originY: number;
}

export function buildFreeSpace(map: SiteMap): FreeSpace {
  const grid = map.grid;
  let cells = new Int32Array(0);
  if (grid) {
    let count = 0;
    for (let k = 0; k < grid.cells.length; k++) if (grid.cells[k] === CELL_FREE) count++;
    cells = new Int32Array(count);
    let next = 0;
    for (let k = 0; k < grid.cells.length; k++) if (grid.cells[k] === CELL_FREE) cells[next++] = k;
  }
  return {
    cells,
    width: map.width,
    height: map.height,
    resolution: map.resolution,
    originX: map.origin[0],
    originY: map.origin[1],
  };
}

/**
 * Writes a pose drawn uniformly over free space (map frame, m and rad) from four uniforms in (0, 1)
 * into x[i], y[i], theta[i].
 */
export function placeUniformPose(
  space: FreeSpace,
  u0: number,
  u1: number,
  u2: number,
  u3: number,
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  i: number,
): void {
  if (space.cells.length > 0) {
    const cell = space.cells[Math.min(space.cells.length - 1, Math.floor(u0 * space.cells.length))];
    const row = Math.floor(cell / space.width);
    const column = cell - row * space.width;
    x[i] = space.originX + (column + u1) * space.resolution;
    y[i] = space.originY + (space.height - 1 - row + u2) * space.resolution;
  } else {
    x[i] = space.originX + u1 * space.width * space.resolution;
    y[i] = space.originY + u2 * space.height * space.resolution;
  }
  theta[i] = Math.PI * (2 * u3 - 1);
}
