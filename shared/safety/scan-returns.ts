/**
 * Scan returns in the robot frame, for clearance to what the sensor saw (a moved rack, a person, a
 * pallet truck the map does not show). Because both the returns and the footprint are fixed to the
 * robot, the footprint-to-return distance does not depend on which pose estimate is used.
 */
import type { Footprint, ScanConfig, ScanTable } from '../bundle/types';
import { cos, sin } from '../engine/numerics';
import { pointToFootprint } from './footprint-geometry';

/** Beams each side whose ranges are pooled (median of up to 2 * HALF_WINDOW + 1). */
const HALF_WINDOW = 2;
/** A beam is used only when at least this many ranges of its window are valid. */
const MIN_VALID = 3;

/** Median of the first `count` entries of `values` (sorted in place). */
function median(values: Float64Array, count: number): number {
  const part = values.subarray(0, count).sort();
  return count % 2 === 1 ? part[(count - 1) / 2] : (part[count / 2 - 1] + part[count / 2]) / 2;
}

/**
 * Robot-frame endpoints [x0, y0, x1, y1, ...] (m) of scan `index`, each beam's range replaced by
 * the median of the valid ranges within two beams of it. Real surfaces are seen by neighbouring
 * beams, so the median keeps them while a lone short return (dust, noise) or a lone dropout
 * disappears, and range noise shrinks. Ranges outside [range_min, range_max) and missing ones
 * (NaN) are not valid; a beam with fewer than 3 valid ranges in its window is skipped.
 */
export function robotFrameReturns(scans: ScanTable, index: number, scan: ScanConfig): Float64Array {
  const beams = scans.beams;
  const valid = new Float64Array(beams).fill(Number.NaN);
  for (let b = 0; b < beams; b++) {
    const r = scans.ranges[index * beams + b];
    if (r >= scan.range_min && r < scan.range_max) valid[b] = r;
  }
  const [mx, my, mt] = scan.mount;
  const pool = new Float64Array(2 * HALF_WINDOW + 1);
  const out: number[] = [];
  for (let b = 0; b < beams; b++) {
    if (Number.isNaN(valid[b])) continue;
    let count = 0;
    for (let n = Math.max(0, b - HALF_WINDOW); n <= Math.min(beams - 1, b + HALF_WINDOW); n++) {
      if (!Number.isNaN(valid[n])) pool[count++] = valid[n];
    }
    if (count < MIN_VALID) continue;
    const r = median(pool, count);
    const angle = mt + scan.angle_min + b * scan.angle_increment;
    out.push(mx + r * cos(angle), my + r * sin(angle));
  }
  return Float64Array.from(out);
}

/** Distance (m) from the footprint to the nearest of the robot-frame points; null when there are none. */
export function footprintToPoints(footprint: Footprint, points: ArrayLike<number>): number | null {
  let best = Number.POSITIVE_INFINITY;
  for (let k = 0; k < points.length; k += 2) {
    const d = pointToFootprint(footprint, points[k], points[k + 1]);
    if (d < best) best = d;
  }
  return Number.isFinite(best) ? best : null;
}

/**
 * Free travel (m) of the footprint straight ahead (direction +1) or astern (-1) before it touches
 * one of the robot-frame points; null when no point lies in its swept path.
 */
export function travelToPoints(
  footprint: Footprint,
  points: ArrayLike<number>,
  direction: 1 | -1,
): number | null {
  let best = Number.POSITIVE_INFINITY;
  for (let k = 0; k < points.length; k += 2) {
    const ahead = direction * points[k];
    const side = Math.abs(points[k + 1]);
    let free: number;
    if (footprint.shape === 'circle') {
      if (side >= footprint.radius) continue;
      free = ahead - Math.sqrt(footprint.radius * footprint.radius - side * side);
    } else {
      if (side >= footprint.width / 2) continue;
      free = ahead - footprint.length / 2;
    }
    // A point already behind the leading edge is inside or beside the footprint, not in its path.
    if (ahead <= 0) continue;
    if (free < best) best = Math.max(0, free);
  }
  return Number.isFinite(best) ? best : null;
}
