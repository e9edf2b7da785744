import type { SimGrid } from './sim-grid';

/**
 * Distance (m) along a ray from (x, y) at `angle` (rad, map frame) to the first occupied cell,
 * or `Infinity` when none lies within `maxRange`. Visits each crossed cell exactly once with the
 * grid traversal of Amanatides and Woo, "A Fast Voxel Traversal Algorithm for Ray Tracing" (1987),
 * so the returned distance is where the ray enters the occupied cell's boundary.
 */
export function castRay(grid: SimGrid, x: number, y: number, angle: number, maxRange: number): number {
  const res = grid.resolution;
  const gx = (x - grid.originX) / res;
  const gy = (y - grid.originY) / res;
  let ix = Math.floor(gx);
  let iy = Math.floor(gy);
  const { width, height, occupied } = grid;
  if (ix < 0 || iy < 0 || ix >= width || iy >= height) return Infinity;
  if (occupied[iy * width + ix] === 1) return 0;

  const dx = Math.cos(angle);
  const dy = Math.sin(angle);
  const stepX = dx > 0 ? 1 : -1;
  const stepY = dy > 0 ? 1 : -1;
  const tDeltaX = dx !== 0 ? Math.abs(res / dx) : Infinity;
  const tDeltaY = dy !== 0 ? Math.abs(res / dy) : Infinity;
  let tMaxX = dx > 0 ? ((ix + 1 - gx) * res) / dx : dx < 0 ? ((gx - ix) * res) / -dx : Infinity;
  let tMaxY = dy > 0 ? ((iy + 1 - gy) * res) / dy : dy < 0 ? ((gy - iy) * res) / -dy : Infinity;

  for (;;) {
    let distance: number;
    if (tMaxX < tMaxY) {
      ix += stepX;
      distance = tMaxX;
      tMaxX += tDeltaX;
    } else {
      iy += stepY;
      distance = tMaxY;
      tMaxY += tDeltaY;
    }
    if (distance > maxRange) return Infinity;
    if (ix < 0 || iy < 0 || ix >= width || iy >= height) return Infinity;
    if (occupied[iy * width + ix] === 1) return distance;
  }
}
