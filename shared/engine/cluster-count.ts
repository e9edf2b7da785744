/**
 * Cheap count of belief clusters: particles are binned on a square grid (CLUSTER_BIN_SIZE m), bins
 * holding weight are joined with their 8 neighbours into connected components, and components
 * holding at least CLUSTER_MIN_WEIGHT of the total weight are counted. A belief spanning at most
 * 2 x 2 bins is one cluster without building the grid (all its bins touch).
 */

/** m */
export const CLUSTER_BIN_SIZE = 0.5;
/** Fraction of total weight a component needs to count as a cluster. */
export const CLUSTER_MIN_WEIGHT = 0.05;
/** Largest bin grid built; wider beliefs use proportionally coarser bins. */
const MAX_BINS = 1 << 20;

/** Reusable buffers, grown on demand. */
export interface ClusterScratch {
  binWeight: Float64Array;
  label: Int32Array;
  stack: Int32Array;
}

export function createClusterScratch(): ClusterScratch {
  return { binWeight: new Float64Array(0), label: new Int32Array(0), stack: new Int32Array(0) };
}

function ensureCapacity(scratch: ClusterScratch, cells: number): void {
  if (scratch.binWeight.length >= cells) return;
  scratch.binWeight = new Float64Array(cells);
  scratch.label = new Int32Array(cells);
  scratch.stack = new Int32Array(cells);
}

/** Number of clusters of particles [0, n) with normalised weights (positions in m, map frame). */
export function countBeliefClusters(
  x: Float64Array,
  y: Float64Array,
  weights: Float64Array,
  n: number,
  scratch: ClusterScratch,
): number {
  if (n === 0) return 0;
  let minX = x[0];
  let maxX = x[0];
  let minY = y[0];
  let maxY = y[0];
  for (let i = 1; i < n; i++) {
    if (x[i] < minX) minX = x[i];
    else if (x[i] > maxX) maxX = x[i];
    if (y[i] < minY) minY = y[i];
    else if (y[i] > maxY) maxY = y[i];
  }
  let bin = CLUSTER_BIN_SIZE;
  let columns = Math.floor((maxX - minX) / bin) + 1;
  let rows = Math.floor((maxY - minY) / bin) + 1;
  if (columns <= 2 && rows <= 2) return 1;
  if (columns * rows > MAX_BINS) {
    bin *= Math.sqrt((columns * rows) / MAX_BINS) * 1.01;
    columns = Math.floor((maxX - minX) / bin) + 1;
    rows = Math.floor((maxY - minY) / bin) + 1;
  }
  const cells = columns * rows;
  ensureCapacity(scratch, cells);
  const { binWeight, label, stack } = scratch;
  binWeight.fill(0, 0, cells);
  label.fill(0, 0, cells);
  for (let i = 0; i < n; i++) {
    const column = Math.floor((x[i] - minX) / bin);
    const row = Math.floor((y[i] - minY) / bin);
    binWeight[row * columns + column] += weights[i] + 1e-300;
  }
  let clusters = 0;
  let nextLabel = 0;
  for (let seed = 0; seed < cells; seed++) {
    if (binWeight[seed] === 0 || label[seed] !== 0) continue;
    nextLabel++;
    label[seed] = nextLabel;
    let top = 0;
    stack[top++] = seed;
    let componentWeight = 0;
    while (top > 0) {
      const cell = stack[--top];
      componentWeight += binWeight[cell];
      const row = Math.floor(cell / columns);
      const column = cell - row * columns;
      for (let dr = -1; dr <= 1; dr++) {
        const r = row + dr;
        if (r < 0 || r >= rows) continue;
        for (let dc = -1; dc <= 1; dc++) {
          const c = column + dc;
          if (c < 0 || c >= columns) continue;
          const neighbour = r * columns + c;
          if (binWeight[neighbour] === 0 || label[neighbour] !== 0) continue;
          label[neighbour] = nextLabel;
          stack[top++] = neighbour;
        }
      }
    }
    if (componentWeight >= CLUSTER_MIN_WEIGHT) clusters++;
  }
  return Math.max(1, clusters);
}
