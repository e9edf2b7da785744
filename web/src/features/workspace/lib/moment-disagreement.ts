import type { TBundleMap } from '@shared/contracts/bundle-views';

/**
 * The map disagreement of one step: per map cell (row 0 northmost, as map.json), how many of the
 * step's scan endpoints fell on a cell the map calls free. The whole-replay heat map counts the
 * same thing over every step (the server's disagreement file); this is its "at this moment" view.
 * `scanEndpoints` is [x0, y0, x1, y1, ...] in the map frame (m), x1/y1 being the beam's end.
 */
export function momentDisagreement(map: TBundleMap, scanEndpoints: readonly number[]): Uint32Array {
  const out = new Uint32Array(map.width * map.height);
  if (!map.rows) return out;
  for (let k = 0; k + 3 < scanEndpoints.length; k += 4) {
    const column = Math.floor((scanEndpoints[k + 2] - map.origin[0]) / map.resolution);
    const rowFromSouth = Math.floor((scanEndpoints[k + 3] - map.origin[1]) / map.resolution);
    if (column < 0 || column >= map.width || rowFromSouth < 0 || rowFromSouth >= map.height) continue;
    const row = map.height - 1 - rowFromSouth;
    if (map.rows[row][column] === '.') out[row * map.width + column]++;
  }
  return out;
}
