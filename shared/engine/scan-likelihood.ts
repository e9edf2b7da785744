/**
 * The scan-weighting kernel of the likelihood-field model (Thrun, Burgard, Fox, Probabilistic
 * Robotics, 2005, Table 6.3): per particle, the sum of table log-likelihoods at the beam endpoints
 * transformed by the particle pose. This is the engine's hottest loop (about 40 % of a replay).
 *
 * Cell lookup: map-frame endpoint -> grid coordinate u = (x - origin) / resolution + 1, truncated
 * with `| 0`. Coordinates in [0, width + 2) address the map with a one-cell floor border (anything
 * in (-1, 0) truncates to 0 and lands on the border); anything else gets the floor value. The table
 * carries `padding` cells of floor on every side, so for a particle whose whole scan stays inside
 * the table the lookup needs no bounds check, and gives exactly what the checked lookup gives.
 */
import type { LikelihoodField } from './likelihood-field';

/**
 * Adds, for each particle i in [from, to), the sum over `count` robot-frame endpoints (m) of the
 * field's log-likelihood at the endpoint transformed by the particle pose (map frame) into `out[i]`.
 * `cosTheta`/`sinTheta` hold the particles' heading cosines and sines (computed once per step).
 *
 * Particles go two at a time: one particle's sum is a serial chain of additions, and two
 * independent chains let the processor overlap them. Each particle still adds its beams in order
 * 0..count-1 from 0, so the result is bit-identical to one particle at a time.
 */
export function accumulateScanLogLikelihood(
  field: LikelihoodField,
  x: Float64Array,
  y: Float64Array,
  cosTheta: Float64Array,
  sinTheta: Float64Array,
  from: number,
  to: number,
  endX: Float64Array,
  endY: Float64Array,
  count: number,
  out: Float64Array,
): void {
  const { inverseResolution, originX, originY, paddedLogLikelihood: table, floorLogLikelihood } = field;
  const borderWidth = field.width + 2;
  const borderHeight = field.height + 2;
  const tableWidth = field.width + 2 * field.padding;
  // Index of coordinate (0, 0), the south-west border cell, in the padded table.
  const base = (field.padding - 1) * (tableWidth + 1);
  // A particle whose grid coordinate is at least `reach` cells (plus a cell for rounding) inside
  // the table's edge cannot send an endpoint outside it.
  let reachSquared = 0;
  for (let k = 0; k < count; k++)
    reachSquared = Math.max(reachSquared, endX[k] * endX[k] + endY[k] * endY[k]);
  const reach = Math.sqrt(reachSquared) * inverseResolution + 1;
  const low = -(field.padding - 1) + reach;
  const highX = borderWidth + field.padding - 1 - reach;
  const highY = borderHeight + field.padding - 1 - reach;
  // An odd range starts with one particle paired with itself (its second sum is discarded).
  for (let i = from, j = (to - from) % 2 === 1 ? from : from + 1; j < to; i = j + 1, j = i + 1) {
    const gridXa = (x[i] - originX) * inverseResolution + 1;
    const gridYa = (y[i] - originY) * inverseResolution + 1;
    const cosA = cosTheta[i] * inverseResolution;
    const sinA = sinTheta[i] * inverseResolution;
    const gridXb = (x[j] - originX) * inverseResolution + 1;
    const gridYb = (y[j] - originY) * inverseResolution + 1;
    const cosB = cosTheta[j] * inverseResolution;
    const sinB = sinTheta[j] * inverseResolution;
    let sumA = 0;
    let sumB = 0;
    const isInside =
      gridXa >= low &&
      gridXa <= highX &&
      gridYa >= low &&
      gridYa <= highY &&
      gridXb >= low &&
      gridXb <= highX &&
      gridYb >= low &&
      gridYb <= highY;
    if (isInside) {
      for (let k = 0; k < count; k++) {
        const ex = endX[k];
        const ey = endY[k];
        sumA +=
          table[
            base +
              ((gridYa + sinA * ex + cosA * ey) | 0) * tableWidth +
              ((gridXa + cosA * ex - sinA * ey) | 0)
          ];
        sumB +=
          table[
            base +
              ((gridYb + sinB * ex + cosB * ey) | 0) * tableWidth +
              ((gridXb + cosB * ex - sinB * ey) | 0)
          ];
      }
    } else {
      for (let k = 0; k < count; k++) {
        const ex = endX[k];
        const ey = endY[k];
        const columnA = (gridXa + cosA * ex - sinA * ey) | 0;
        const rowA = (gridYa + sinA * ex + cosA * ey) | 0;
        const columnB = (gridXb + cosB * ex - sinB * ey) | 0;
        const rowB = (gridYb + sinB * ex + cosB * ey) | 0;
        sumA +=
          columnA >>> 0 < borderWidth && rowA >>> 0 < borderHeight
            ? table[base + rowA * tableWidth + columnA]
            : floorLogLikelihood;
        sumB +=
          columnB >>> 0 < borderWidth && rowB >>> 0 < borderHeight
            ? table[base + rowB * tableWidth + columnB]
            : floorLogLikelihood;
      }
    }
    if (i !== j) out[i] += sumA;
    out[j] += sumB;
  }
}
