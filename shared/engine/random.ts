/**
 * Counter-based random numbers: Philox4x32-10 (Salmon, Moraes, Dror, Shaw, "Parallel random numbers:
 * as easy as 1, 2, 3", SC 2011).
 *
 * A counter-based generator is a keyed bijection of a 128-bit counter, so the numbers for
 * (seed, purpose, step, particle, draw) are computed directly, without a sequential stream. That is
 * what makes a replay independent of how the particles are split across threads and lets a replay
 * resume at any step from a keyframe: the generator state IS the step index.
 *
 * Layout used throughout the engine:
 * - key   = [seed mod 2^32, floor(seed / 2^32)] (seed is a non-negative integer below 2^53)
 * - counter = [draw block, particle (or output slot), step, purpose]
 * Each call yields four 32-bit words. Uniforms have 32-bit resolution: u = (word + 0.5) / 2^32,
 * which lies strictly inside (0, 1) so logarithms in Box–Muller are always finite.
 */

/** Purposes keep the streams of different engine stages apart (fourth counter word). */
export const RNG_PURPOSE = {
  initialBelief: 1,
  motion: 2,
  resampling: 3,
  injection: 4,
  kld: 5,
  test: 99,
} as const;

const PHILOX_M0 = 0xd2511f53;
const PHILOX_M1 = 0xcd9e8d57;
const PHILOX_W0 = 0x9e3779b9;
const PHILOX_W1 = 0xbb67ae85;
const M0_HI = PHILOX_M0 >>> 16;
const M0_LO = PHILOX_M0 & 0xffff;
const M1_HI = PHILOX_M1 >>> 16;
const M1_LO = PHILOX_M1 & 0xffff;
const TWO_POW_16 = 65536;
const TWO_POW_32 = 4294967296;
const UNIFORM_SCALE = 1 / TWO_POW_32;
const TWO_PI = 2 * Math.PI;

/**
 * Philox4x32 with 10 rounds. Writes the four output words to `out[0..3]` (unsigned 32-bit).
 * All inputs are unsigned 32-bit integers.
 */
export function philox4x32(
  c0: number,
  c1: number,
  c2: number,
  c3: number,
  k0: number,
  k1: number,
  out: Uint32Array,
): void {
  let x0 = c0 >>> 0;
  let x1 = c1 >>> 0;
  let x2 = c2 >>> 0;
  let x3 = c3 >>> 0;
  let key0 = k0 >>> 0;
  let key1 = k1 >>> 0;
  for (let round = 0; round < 10; round++) {
    // High words of the 32x32 products from 16-bit halves: every partial sum stays below 2^53,
    // so the float arithmetic is exact (JavaScript has no 64-bit integer multiply on numbers).
    const a0High = x0 >>> 16;
    const a0Low = x0 & 0xffff;
    const cross0 = a0High * M0_LO + a0Low * M0_HI + ((a0Low * M0_LO) >>> 16);
    const hi0 = (a0High * M0_HI + Math.floor(cross0 / TWO_POW_16)) >>> 0;
    const lo0 = Math.imul(x0, PHILOX_M0) >>> 0;
    const a2High = x2 >>> 16;
    const a2Low = x2 & 0xffff;
    const cross2 = a2High * M1_LO + a2Low * M1_HI + ((a2Low * M1_LO) >>> 16);
    const hi1 = (a2High * M1_HI + Math.floor(cross2 / TWO_POW_16)) >>> 0;
    const lo1 = Math.imul(x2, PHILOX_M1) >>> 0;
    x0 = (hi1 ^ x1 ^ key0) >>> 0;
    x1 = lo1;
    x2 = (hi0 ^ x3 ^ key1) >>> 0;
    x3 = lo0;
    key0 = (key0 + PHILOX_W0) >>> 0;
    key1 = (key1 + PHILOX_W1) >>> 0;
  }
  out[0] = x0;
  out[1] = x1;
  out[2] = x2;
  out[3] = x3;
}

/** Reusable scratch for one caller (one per thread); avoids allocation in hot loops. */
export interface RandomScratch {
  words: Uint32Array;
  /** Last four uniforms or normals produced. */
  values: Float64Array;
}

export function createRandomScratch(): RandomScratch {
  return { words: new Uint32Array(4), values: new Float64Array(4) };
}

/** Low key word for a seed (non-negative integer < 2^53). */
export function seedKeyLow(seed: number): number {
  return seed >>> 0;
}

/** High key word for a seed (non-negative integer < 2^53). */
export function seedKeyHigh(seed: number): number {
  return Math.floor(seed / TWO_POW_32) >>> 0;
}

/**
 * Four uniforms in (0, 1), 32-bit resolution, for the counter (draw, particle, step, purpose),
 * written to `scratch.values`.
 */
export function fillUniforms(
  seed: number,
  purpose: number,
  step: number,
  particle: number,
  draw: number,
  scratch: RandomScratch,
): void {
  const words = scratch.words;
  const values = scratch.values;
  philox4x32(draw, particle, step, purpose, seedKeyLow(seed), seedKeyHigh(seed), words);
  values[0] = (words[0] + 0.5) * UNIFORM_SCALE;
  values[1] = (words[1] + 0.5) * UNIFORM_SCALE;
  values[2] = (words[2] + 0.5) * UNIFORM_SCALE;
  values[3] = (words[3] + 0.5) * UNIFORM_SCALE;
}

/**
 * Three standard normals for the counter (draw, particle, step, purpose) with the key words
 * already split (see seedKeyLow/seedKeyHigh), written to `scratch.values[0..2]`: the first three
 * outputs of `fillNormals`, without computing the unused fourth. Hot-loop variant for motion noise.
 */
export function fillThreeNormals(
  keyLow: number,
  keyHigh: number,
  purpose: number,
  step: number,
  particle: number,
  scratch: RandomScratch,
): void {
  const words = scratch.words;
  const values = scratch.values;
  philox4x32(0, particle, step, purpose, keyLow, keyHigh, words);
  const radiusA = Math.sqrt(-2 * Math.log((words[0] + 0.5) * UNIFORM_SCALE));
  const angleA = TWO_PI * ((words[1] + 0.5) * UNIFORM_SCALE);
  const radiusB = Math.sqrt(-2 * Math.log((words[2] + 0.5) * UNIFORM_SCALE));
  const angleB = TWO_PI * ((words[3] + 0.5) * UNIFORM_SCALE);
  values[0] = radiusA * Math.cos(angleA);
  values[1] = radiusA * Math.sin(angleA);
  values[2] = radiusB * Math.cos(angleB);
}

/**
 * Four standard normals for the counter (draw, particle, step, purpose), written to
 * `scratch.values`, from two Box–Muller pairs (Box & Muller 1958) over one Philox block.
 */
export function fillNormals(
  seed: number,
  purpose: number,
  step: number,
  particle: number,
  draw: number,
  scratch: RandomScratch,
): void {
  fillUniforms(seed, purpose, step, particle, draw, scratch);
  const values = scratch.values;
  const radiusA = Math.sqrt(-2 * Math.log(values[0]));
  const angleA = TWO_PI * values[1];
  const radiusB = Math.sqrt(-2 * Math.log(values[2]));
  const angleB = TWO_PI * values[3];
  values[0] = radiusA * Math.cos(angleA);
  values[1] = radiusA * Math.sin(angleA);
  values[2] = radiusB * Math.cos(angleB);
  values[3] = radiusB * Math.sin(angleB);
}
