/**
 * Spatial index of the landmarks for association: buckets by true class and grid cell (CSR
 * layout), queried per detection with the particle cloud's bounding box before any particle
 * loop. A query returns every landmark that any particle of the box could associate with under
 * the model's gates (range annulus, bearing window, class with non-zero confusion to the reported
 * one): the per-particle loop then looks at one or two landmarks instead of all of them.
 * Everything is a superset of what the per-particle gates pass, so the index never changes a result.
 */
import { atan2 } from './numerics';
import { wrapAngle } from './stats';

export interface LandmarkIndex {
  minX: number;
  minY: number;
  cellSize: number;
  columns: number;
  rows: number;
  /** Bucket b = trueClass * columns * rows + row * columns + column holds ids[start[b]..start[b + 1]). */
  start: Int32Array;
  ids: Int32Array;
}

/** Relative slack on the query's range bounds, far above the rounding of squares and roots. */
const RANGE_SLACK = 1e-9;
/** Slack (rad) on the query's bearing window, far above the rounding of the angles. */
const BEARING_SLACK = 1e-6;

export function buildLandmarkIndex(
  x: Float64Array,
  y: Float64Array,
  classIndex: Int32Array,
  classCount: number,
  maxRange: number,
): LandmarkIndex {
  let minX = Number.POSITIVE_INFINITY;
  let minY = Number.POSITIVE_INFINITY;
  let maxX = Number.NEGATIVE_INFINITY;
  let maxY = Number.NEGATIVE_INFINITY;
  for (let l = 0; l < x.length; l++) {
    minX = Math.min(minX, x[l]);
    maxX = Math.max(maxX, x[l]);
    minY = Math.min(minY, y[l]);
    maxY = Math.max(maxY, y[l]);
  }
  if (x.length === 0) minX = minY = maxX = maxY = 0;
  // Cells a quarter of the detector's reach: a query covers about 9 x 9 cells at full range.
  const cellSize = Math.max(0.5, maxRange / 4);
  const columns = Math.min(1024, Math.floor((maxX - minX) / cellSize) + 1);
  const rows = Math.min(1024, Math.floor((maxY - minY) / cellSize) + 1);
  const cellOf = (l: number) =>
    classIndex[l] * columns * rows +
    Math.min(rows - 1, Math.floor((y[l] - minY) / cellSize)) * columns +
    Math.min(columns - 1, Math.floor((x[l] - minX) / cellSize));
  const buckets = classCount * columns * rows;
  const start = new Int32Array(buckets + 1);
  for (let l = 0; l < x.length; l++) if (classIndex[l] >= 0) start[cellOf(l) + 1]++;
  for (let b = 0; b < buckets; b++) start[b + 1] += start[b];
  const fill = start.slice(0, buckets);
  const ids = new Int32Array(start[buckets]);
  for (let l = 0; l < x.length; l++) if (classIndex[l] >= 0) ids[fill[cellOf(l)]++] = l;
  return { minX, minY, cellSize, columns, rows, start, ids };
}

/** What a query needs about the detection and the particle cloud (all map frame, m and rad). */
export interface LandmarkQuery {
  /** Classes whose confusion to the reported class is non-zero. */
  classes: ArrayLike<number>;
  boxMinX: number;
  boxMaxX: number;
  boxMinY: number;
  boxMaxY: number;
  /** Distance window [lower, upper] (m) a landmark must be able to fall in. */
  lower: number;
  upper: number;
  /** Detection bearing (robot frame), a reference heading of the cloud and the headings' spread around it. */
  bearing: number;
  headingRef: number;
  headingSpread: number;
  /** Half-width (rad) of the bearing window; >= pi disables the bearing test. */
  bearingGate: number;
}

/**
 * Writes the candidate landmarks of `query` to `out` and returns how many. Range: the exact
 * nearest and farthest distance from the box (with RANGE_SLACK). Bearing: every particle's
 * direction to the landmark lies within asin(h / d) <= h / sqrt(d^2 - h^2) of the direction from
 * the box centre (h the half-diagonal, d the centre distance), headings within `headingSpread`
 * of `headingRef`, so a landmark outside gate + both spreads (+ BEARING_SLACK) is skipped.
 */
export function queryLandmarks(
  index: LandmarkIndex,
  lx: Float64Array,
  ly: Float64Array,
  query: LandmarkQuery,
  out: Int32Array,
): number {
  const { boxMinX, boxMaxX, boxMinY, boxMaxY } = query;
  const upper = query.upper * (1 + RANGE_SLACK);
  const lower = query.lower * (1 - RANGE_SLACK);
  const upperSquared = upper * upper;
  const lowerSquared = lower * lower;
  const { minX, minY, cellSize, columns, rows, start, ids } = index;
  const c0 = Math.max(0, Math.floor((boxMinX - upper - minX) / cellSize));
  const c1 = Math.min(columns - 1, Math.floor((boxMaxX + upper - minX) / cellSize));
  const r0 = Math.max(0, Math.floor((boxMinY - upper - minY) / cellSize));
  const r1 = Math.min(rows - 1, Math.floor((boxMaxY + upper - minY) / cellSize));
  const centreX = 0.5 * (boxMinX + boxMaxX);
  const centreY = 0.5 * (boxMinY + boxMaxY);
  const halfX = 0.5 * (boxMaxX - boxMinX);
  const halfY = 0.5 * (boxMaxY - boxMinY);
  const halfDiagonalSquared = halfX * halfX + halfY * halfY;
  const testBearing = query.bearingGate < Math.PI;
  let count = 0;
  for (let k = 0; k < query.classes.length; k++) {
    const classBase = query.classes[k] * columns * rows;
    for (let r = r0; r <= r1; r++) {
      for (let c = c0; c <= c1; c++) {
        const bucket = classBase + r * columns + c;
        for (let p = start[bucket]; p < start[bucket + 1]; p++) {
          const l = ids[p];
          const x = lx[l];
          const y = ly[l];
          const nearX = x < boxMinX ? x - boxMinX : x > boxMaxX ? x - boxMaxX : 0;
          const nearY = y < boxMinY ? y - boxMinY : y > boxMaxY ? y - boxMaxY : 0;
          if (nearX * nearX + nearY * nearY > upperSquared) continue;
          const farX = Math.max(Math.abs(x - boxMinX), Math.abs(x - boxMaxX));
          const farY = Math.max(Math.abs(y - boxMinY), Math.abs(y - boxMaxY));
          if (farX * farX + farY * farY < lowerSquared) continue;
          if (testBearing) {
            const dx = x - centreX;
            const dy = y - centreY;
            const centreSquared = dx * dx + dy * dy;
            if (centreSquared > halfDiagonalSquared) {
              const directionSpread = Math.sqrt(halfDiagonalSquared / (centreSquared - halfDiagonalSquared));
              const offset = Math.abs(wrapAngle(query.bearing + query.headingRef - atan2(dy, dx)));
              if (offset > query.bearingGate + query.headingSpread + directionSpread + BEARING_SLACK)
                continue;
            }
          }
          out[count++] = l;
        }
      }
    }
  }
  return count;
}
