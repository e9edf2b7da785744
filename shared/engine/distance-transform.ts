/**
 * Exact squared Euclidean distance transform (Felzenszwalb & Huttenlocher, "Distance Transforms of
 * Sampled Functions", Theory of Computing 8, 2012): a 1-D lower envelope of parabolas along
 * every column, then along every row. O(width * height).
 */

/** Value standing for "no feature" in the input and "infinitely far" in the output. */
export const FAR = 1e20;

/**
 * 1-D squared distance transform of `f` (length n, sampled at integer positions), into `out`.
 * `vertices` (Int32Array n) and `bounds` (Float64Array n + 1) are scratch.
 */
function transformLine(
  f: Float64Array,
  n: number,
  out: Float64Array,
  vertices: Int32Array,
  bounds: Float64Array,
): void {
  // FAR is finite so a line without features still gives finite (huge) parabolas that any real
  // feature dominates, exactly as in the paper's reference code.
  let k = 0;
  vertices[0] = 0;
  bounds[0] = Number.NEGATIVE_INFINITY;
  bounds[1] = Number.POSITIVE_INFINITY;
  for (let q = 1; q < n; q++) {
    let v = vertices[k];
    let s = (f[q] + q * q - (f[v] + v * v)) / (2 * q - 2 * v);
    while (s <= bounds[k]) {
      k--;
      v = vertices[k];
      s = (f[q] + q * q - (f[v] + v * v)) / (2 * q - 2 * v);
    }
    k++;
    vertices[k] = q;
    bounds[k] = s;
    bounds[k + 1] = Number.POSITIVE_INFINITY;
  }
  k = 0;
  for (let q = 0; q < n; q++) {
    while (bounds[k + 1] < q) k++;
    const d = q - vertices[k];
    out[q] = d * d + f[vertices[k]];
  }
}

/**
 * Squared distance, in cells^2, from every cell of a width x height row-major grid to the nearest
 * cell where `isFeature[i * width + j]` is true (1). FAR where the grid has no feature at all.
 */
export function squaredDistanceTransform(isFeature: Uint8Array, width: number, height: number): Float64Array {
  const result = new Float64Array(width * height);
  const longest = Math.max(width, height);
  const f = new Float64Array(longest);
  const out = new Float64Array(longest);
  const vertices = new Int32Array(longest);
  const bounds = new Float64Array(longest + 1);
  for (let j = 0; j < width; j++) {
    for (let i = 0; i < height; i++) f[i] = isFeature[i * width + j] ? 0 : FAR;
    transformLine(f, height, out, vertices, bounds);
    for (let i = 0; i < height; i++) result[i * width + j] = out[i];
  }
  for (let i = 0; i < height; i++) {
    for (let j = 0; j < width; j++) f[j] = result[i * width + j];
    transformLine(f, width, out, vertices, bounds);
    for (let j = 0; j < width; j++) result[i * width + j] = out[j] >= FAR / 2 ? FAR : out[j];
  }
  return result;
}
