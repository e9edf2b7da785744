/**
 * Footprint geometry in the robot frame (x forward, y left, origin at the robot's pose), as the
 * manifest describes it: a circle of `radius` or a `length` x `width` rectangle centred on the pose.
 * Distances are Euclidean, in metres; 0 means touching or overlapping.
 */
import type { Footprint } from '../bundle/types';

/** Distance (m) from a robot-frame point to the footprint; 0 inside it. */
export function pointToFootprint(footprint: Footprint, px: number, py: number): number {
  if (footprint.shape === 'circle') return Math.max(0, Math.sqrt(px * px + py * py) - footprint.radius);
  const dx = Math.max(0, Math.abs(px) - footprint.length / 2);
  const dy = Math.max(0, Math.abs(py) - footprint.width / 2);
  return Math.sqrt(dx * dx + dy * dy);
}

/** Radius (m) of the smallest circle about the pose that holds the footprint. */
export function circumscribedRadius(footprint: Footprint): number {
  if (footprint.shape === 'circle') return footprint.radius;
  return Math.sqrt(footprint.length * footprint.length + footprint.width * footprint.width) / 2;
}

/** Radius (m) of the largest circle about the pose inside the footprint. */
export function inscribedRadius(footprint: Footprint): number {
  return footprint.shape === 'circle' ? footprint.radius : Math.min(footprint.length, footprint.width) / 2;
}

/** Distance (m) from point (px, py) to segment (ax, ay)-(bx, by). */
function pointToSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const ex = bx - ax;
  const ey = by - ay;
  const lengthSquared = ex * ex + ey * ey;
  let s = lengthSquared > 0 ? ((px - ax) * ex + (py - ay) * ey) / lengthSquared : 0;
  s = Math.min(1, Math.max(0, s));
  const dx = px - (ax + s * ex);
  const dy = py - (ay + s * ey);
  return Math.sqrt(dx * dx + dy * dy);
}

/** True when the convex polygons (vertex lists [x0, y0, x1, y1, ...], in order) overlap (separating axis test). */
function convexOverlap(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  for (const polygon of [a, b]) {
    const n = polygon.length / 2;
    for (let k = 0; k < n; k++) {
      const next = (k + 1) % n;
      const nx = polygon[2 * next + 1] - polygon[2 * k + 1];
      const ny = polygon[2 * k] - polygon[2 * next];
      let minA = Number.POSITIVE_INFINITY;
      let maxA = Number.NEGATIVE_INFINITY;
      let minB = Number.POSITIVE_INFINITY;
      let maxB = Number.NEGATIVE_INFINITY;
      for (let v = 0; v < a.length; v += 2) {
        const p = a[v] * nx + a[v + 1] * ny;
        minA = Math.min(minA, p);
        maxA = Math.max(maxA, p);
      }
      for (let v = 0; v < b.length; v += 2) {
        const p = b[v] * nx + b[v + 1] * ny;
        minB = Math.min(minB, p);
        maxB = Math.max(maxB, p);
      }
      if (maxA < minB || maxB < minA) return false;
    }
  }
  return true;
}

/** Distance (m) between two convex polygons; 0 when they overlap. */
export function convexPolygonDistance(a: ArrayLike<number>, b: ArrayLike<number>): number {
  if (convexOverlap(a, b)) return 0;
  let best = Number.POSITIVE_INFINITY;
  for (const [points, edges] of [
    [a, b],
    [b, a],
  ] as const) {
    const n = edges.length / 2;
    for (let v = 0; v < points.length; v += 2) {
      for (let k = 0; k < n; k++) {
        const next = (k + 1) % n;
        const d = pointToSegment(
          points[v],
          points[v + 1],
          edges[2 * k],
          edges[2 * k + 1],
          edges[2 * next],
          edges[2 * next + 1],
        );
        if (d < best) best = d;
      }
    }
  }
  return best;
}

/** Map-frame corners of a rectangle footprint at pose (x, y) with heading cosine c and sine s, counter-clockwise. */
export function rectangleCorners(
  footprint: { length: number; width: number },
  x: number,
  y: number,
  c: number,
  s: number,
): Float64Array {
  const hl = footprint.length / 2;
  const hw = footprint.width / 2;
  const corners = new Float64Array(8);
  const local = [hl, hw, -hl, hw, -hl, -hw, hl, -hw];
  for (let k = 0; k < 4; k++) {
    corners[2 * k] = x + c * local[2 * k] - s * local[2 * k + 1];
    corners[2 * k + 1] = y + s * local[2 * k] + c * local[2 * k + 1];
  }
  return corners;
}
