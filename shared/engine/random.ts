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
import { cos, log, sin } from './numerics';

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
const PHILOX_W0 = 0x9e3779b9 | 0;
const PHILOX_W1 = 0xbb67ae85 | 0;
const M0_HI = PHILOX_M0 >>> 16;
const M0_LO = PHILOX_M0 & 0xffff;
const M1_HI = PHILOX_M1 >>> 16;
const M1_LO = PHILOX_M1 & 0xffff;
const TWO_POW_32 = 4294967296;
const UNIFORM_SCALE = 1 / TWO_POW_32;
const TWO_PI = 2 * Math.PI;

/**
 * High 32 bits of the 64-bit product a * m (a a 32-bit word, m = mHigh 2^16 + mLow) from four
 * 16 x 16-bit partial products with Math.imul, all in 32-bit integer arithmetic (JavaScript has no
 * 64-bit integer multiply on numbers; staying in integers avoids float round trips). Returned as
 * a signed 32-bit integer with the right bit pattern.
 */
function multiplyHigh(a: number, mHigh: number, mLow: number): number {
  const aHigh = a >>> 16;
  const aLow = a & 0xffff;
  const lowLow = Math.imul(aLow, mLow);
  const highLow = Math.imul(aHigh, mLow);
  const lowHigh = Math.imul(aLow, mHigh);
  const middle = (lowLow >>> 16) + (highLow & 0xffff) + (lowHigh & 0xffff);
  return (Math.imul(aHigh, mHigh) + (highLow >>> 16) + (lowHigh >>> 16) + (middle >>> 16)) | 0;
}

/**
 * Philox4x32 with 10 rounds. Writes the four output words to `out[0..3]` (unsigned 32-bit).
 * All inputs are unsigned 32-bit integers. Runs the paired kernel on one counter twice so the
 * round function exists once; single blocks are off the hot path (motion uses the pair).
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
  philox4x32Pair(c0, c1, c1, c2, c3, k0, k1, out, 0);
}

/**
 * Two Philox4x32-10 blocks whose counters differ only in the second word (c1First, c1Second),
 * computed interleaved: each round's dependency chain is long, so two independent chains roughly
 * double the throughput. Writes block one to out[0..3] and block two to out[secondOffset..+3]
 * (default 4); each block is exactly Philox4x32-10 of its own counter.
 */
export function philox4x32Pair(
  c0: number,
  c1First: number,
  c1Second: number,
  c2: number,
  c3: number,
  k0: number,
  k1: number,
  out: Uint32Array,
  secondOffset = 4,
): void {
  let a0 = c0 | 0;
  let a1 = c1First | 0;
  let a2 = c2 | 0;
  let a3 = c3 | 0;
  let b0 = a0;
  let b1 = c1Second | 0;
  let b2 = a2;
  let b3 = a3;
  let key0 = k0 | 0;
  let key1 = k1 | 0;
  for (let round = 0; round < 10; round++) {
    const aHi0 = multiplyHigh(a0, M0_HI, M0_LO);
    const aLo0 = Math.imul(a0, PHILOX_M0);
    const aHi1 = multiplyHigh(a2, M1_HI, M1_LO);
    const aLo1 = Math.imul(a2, PHILOX_M1);
    const bHi0 = multiplyHigh(b0, M0_HI, M0_LO);
    const bLo0 = Math.imul(b0, PHILOX_M0);
    const bHi1 = multiplyHigh(b2, M1_HI, M1_LO);
    const bLo1 = Math.imul(b2, PHILOX_M1);
    a0 = aHi1 ^ a1 ^ key0;
    a1 = aLo1;
    a2 = aHi0 ^ a3 ^ key1;
    a3 = aLo0;
    b0 = bHi1 ^ b1 ^ key0;
    b1 = bLo1;
    b2 = bHi0 ^ b3 ^ key1;
    b3 = bLo0;
    key0 = (key0 + PHILOX_W0) | 0;
    key1 = (key1 + PHILOX_W1) | 0;
  }
  out[0] = a0;
  out[1] = a1;
  out[2] = a2;
  out[3] = a3;
  out[secondOffset] = b0;
  out[secondOffset + 1] = b1;
  out[secondOffset + 2] = b2;
  out[secondOffset + 3] = b3;
}

/** Reusable scratch for one caller (one per thread); avoids allocation in hot loops. */
export interface RandomScratch {
  /** Philox output words; eight, so `philox4x32Pair` fits. */
  words: Uint32Array;
  /** Last four uniforms or normals produced. */
  values: Float64Array;
  /** Blocks drawn by the ziggurat's slow path (ziggurat.ts) while `words` holds the caller's block. */
  fallbackWords: Uint32Array;
}

export function createRandomScratch(): RandomScratch {
  return { words: new Uint32Array(8), values: new Float64Array(4), fallbackWords: new Uint32Array(4) };
}

/** Uniform in (0, 1) with 32-bit resolution from one unsigned output word: (word + 0.5) / 2^32. */
export function uniformFromWord(word: number): number {
  return (word + 0.5) * UNIFORM_SCALE;
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
  const radiusA = Math.sqrt(-2 * log(values[0]));
  const angleA = TWO_PI * values[1];
  const radiusB = Math.sqrt(-2 * log(values[2]));
  const angleB = TWO_PI * values[3];
  values[0] = radiusA * cos(angleA);
  values[1] = radiusA * sin(angleA);
  values[2] = radiusB * cos(angleB);
  values[3] = radiusB * sin(angleB);
}
