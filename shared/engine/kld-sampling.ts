/**
 * KLD-sampling (Fox, "Adapting the sample size in particle filters through KLD-sampling",
 * IJRR 22(12), 2003): the number of particles needed so that, with probability 1 - delta, the
 * K-L divergence between the sample-based and the true (binned) posterior stays below epsilon.
 */
import type { KldConfig } from '../bundle/types';
import { normalQuantile } from './stats';

/**
 * Fox (2003), eq. 12: n = (k-1)/(2 eps) * (1 - 2/(9(k-1)) + sqrt(2/(9(k-1))) z_{1-delta})^3,
 * rounded up. k = occupied histogram bins; returns 1 for k <= 1.
 */
export function kldBound(occupiedBins: number, epsilon: number, delta: number): number {
  if (occupiedBins <= 1) return 1;
  const k1 = occupiedBins - 1;
  const a = 2 / (9 * k1);
  const z = normalQuantile(1 - delta);
  const cube = 1 - a + Math.sqrt(a) * z;
  return Math.ceil((k1 / (2 * epsilon)) * cube * cube * cube);
}

const BIN_OFFSET = 1 << 20;

/**
 * Number of distinct (x, y, theta) histogram bins (sizes in m, m, rad) holding the particles
 * indices[0..n) (or particles [0, n) when `indices` is null).
 * Bin keys pack three integers into one float64 (21 + 21 + 11 bits), exact below 2^53.
 */
export function countOccupiedBins(
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  indices: Int32Array | null,
  n: number,
  binSize: readonly [number, number, number],
): number {
  const bins = new Set<number>();
  const thetaBins = Math.ceil((2 * Math.PI) / binSize[2]);
  for (let j = 0; j < n; j++) {
    const i = indices ? indices[j] : j;
    const column = Math.floor(x[i] / binSize[0]) + BIN_OFFSET;
    const row = Math.floor(y[i] / binSize[1]) + BIN_OFFSET;
    const heading = Math.min(thetaBins - 1, Math.floor((theta[i] + Math.PI) / binSize[2]));
    bins.add((column * 2097152 + row) * 2048 + heading);
  }
  return bins.size;
}

/**
 * Particle count for the next generation: the KLD bound over the bins occupied by a trial draw of
 * `drawn` ancestors (indices into the current particles), clamped to [min_particles, max_particles].
 */
export function kldTargetCount(
  x: Float64Array,
  y: Float64Array,
  theta: Float64Array,
  ancestors: Int32Array,
  drawn: number,
  config: KldConfig,
): number {
  const bound = kldBound(
    countOccupiedBins(x, y, theta, ancestors, drawn, config.bin_size),
    config.epsilon,
    config.delta,
  );
  return Math.max(config.min_particles, Math.min(config.max_particles, bound));
}
