import { describe, expect, it } from 'vitest';
import {
  createRandomScratch,
  fillNormals,
  fillUniforms,
  philox4x32,
  philox4x32Pair,
  RNG_PURPOSE,
} from '../../../shared/engine/random';

const hex = (words: Uint32Array) => Array.from(words, (w) => w.toString(16).padStart(8, '0')).join(' ');

describe('philox4x32-10', () => {
  // Random123 known-answer vectors, kat_vectors "philox4x32 10" (Salmon et al. 2011); values from
  // memory, and they agree with this implementation, which was written from the paper's round function.
  it.each([
    [[0, 0, 0, 0, 0, 0], '6627e8d5 e169c58d bc57ac4c 9b00dbd8'],
    [
      [0xffffffff, 0xffffffff, 0xffffffff, 0xffffffff, 0xffffffff, 0xffffffff],
      '408f276d 41c83b0e a20bc7c6 6d5451fd',
    ],
    [
      [0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344, 0xa4093822, 0x299f31d0],
      'd16cfe09 94fdcceb 5001e420 24126ea1',
    ],
  ])('matches the known-answer vector for counter/key %j', (input, expected) => {
    const out = new Uint32Array(4);
    const [c0, c1, c2, c3, k0, k1] = input;
    philox4x32(c0, c1, c2, c3, k0, k1, out);
    expect(hex(out)).toBe(expected);
  });

  it('computes two interleaved blocks equal to the known-answer vectors of each counter', () => {
    // Random123 kat_vectors "philox4x32 10", zero counter and key (value from memory, as above).
    const pair = new Uint32Array(8);
    philox4x32Pair(0, 0, 0, 0, 0, 0, 0, pair);
    expect(hex(pair.subarray(0, 4))).toBe('6627e8d5 e169c58d bc57ac4c 9b00dbd8');
    expect(hex(pair.subarray(4, 8))).toBe('6627e8d5 e169c58d bc57ac4c 9b00dbd8');
    const single = new Uint32Array(4);
    for (const [first, second] of [
      [1, 2],
      [0x7fffffff, 0x80000000],
      [0xfffffffe, 0xffffffff],
    ]) {
      philox4x32Pair(0x243f6a88, first, second, 0x13198a2e, 0x03707344, 0xa4093822, 0x299f31d0, pair);
      philox4x32(0x243f6a88, first, 0x13198a2e, 0x03707344, 0xa4093822, 0x299f31d0, single);
      expect(hex(pair.subarray(0, 4))).toBe(hex(single));
      philox4x32(0x243f6a88, second, 0x13198a2e, 0x03707344, 0xa4093822, 0x299f31d0, single);
      expect(hex(pair.subarray(4, 8))).toBe(hex(single));
    }
  });

  it('equals an independent 64-bit integer (BigInt) implementation of the round function on many counters', () => {
    // Philox4x32 round (Salmon et al. 2011, section 4.2): (hi(M0 c0) ^ c1 ^ k0, lo(M1 c2),
    // hi(M1 c2) ^ c3 ^ k1, lo(M0 c0)) with the full 64-bit products, the key bumped by the
    // Weyl constants after each of 10 rounds. Words with every high bit set stress the products.
    const mask = 0xffffffffn;
    const reference = (counter: number[], key: number[]) => {
      let [c0, c1, c2, c3] = counter.map(BigInt);
      let [k0, k1] = key.map(BigInt);
      for (let round = 0; round < 10; round++) {
        const p0 = 0xd2511f53n * c0;
        const p1 = 0xcd9e8d57n * c2;
        [c0, c1, c2, c3] = [(p1 >> 32n) ^ c1 ^ k0, p1 & mask, (p0 >> 32n) ^ c3 ^ k1, p0 & mask];
        k0 = (k0 + 0x9e3779b9n) & mask;
        k1 = (k1 + 0xbb67ae85n) & mask;
      }
      return [c0, c1, c2, c3].map((w) => w.toString(16).padStart(8, '0')).join(' ');
    };
    let state = 12345;
    const word = () => {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0; // 32-bit LCG, common practice
      return state % 5 === 0 ? 0xffffffff - (state & 0xff) : state;
    };
    const out = new Uint32Array(4);
    for (let n = 0; n < 300; n++) {
      const counter = [word(), word(), word(), word()];
      const key = [word(), word()];
      philox4x32(counter[0], counter[1], counter[2], counter[3], key[0], key[1], out);
      expect(hex(out)).toBe(reference(counter, key));
    }
  });

  it('gives the same numbers for a particle whatever order particles are drawn in', () => {
    const scratch = createRandomScratch();
    fillNormals(42, RNG_PURPOSE.motion, 17, 999, 0, scratch);
    const alone = Array.from(scratch.values);
    for (let i = 0; i < 999; i++) fillNormals(42, RNG_PURPOSE.motion, 17, i, 0, scratch);
    fillNormals(42, RNG_PURPOSE.motion, 17, 999, 0, scratch);
    expect(Array.from(scratch.values)).toEqual(alone);
    fillNormals(43, RNG_PURPOSE.motion, 17, 999, 0, scratch);
    expect(Array.from(scratch.values)).not.toEqual(alone);
  });
});

describe('uniforms and normals', () => {
  it('keeps uniforms strictly inside (0, 1) with mean 1/2 and variance 1/12', () => {
    const scratch = createRandomScratch();
    let sum = 0;
    let sumSquares = 0;
    let outside = 0;
    const n = 400_000;
    for (let i = 0; i < n / 4; i++) {
      fillUniforms(5, RNG_PURPOSE.test, 0, i, 0, scratch);
      for (const u of scratch.values) {
        if (!(u > 0 && u < 1)) outside++;
        sum += u;
        sumSquares += u * u;
      }
    }
    expect(outside).toBe(0);
    const mean = sum / n;
    // Standard error of the mean of U(0,1): sqrt(1/12 / n) ≈ 4.6e-4; 5 standard errors allowed.
    expect(Math.abs(mean - 0.5)).toBeLessThan(5 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(sumSquares / n - mean * mean - 1 / 12)).toBeLessThan(0.002);
  });

  it('produces standard normals: mean 0, variance 1, P(|z| < 1.96) ≈ 0.95', () => {
    const scratch = createRandomScratch();
    const n = 400_000;
    let sum = 0;
    let sumSquares = 0;
    let inside = 0;
    for (let i = 0; i < n / 4; i++) {
      fillNormals(9, RNG_PURPOSE.test, 3, i, 0, scratch);
      for (const z of scratch.values) {
        sum += z;
        sumSquares += z * z;
        if (Math.abs(z) < 1.959964) inside++;
      }
    }
    // Standard normal table: P(|Z| < 1.959964) = 0.95 (common practice value).
    expect(Math.abs(sum / n)).toBeLessThan(5 / Math.sqrt(n));
    expect(Math.abs(sumSquares / n - 1)).toBeLessThan(5 * Math.sqrt(2 / n));
    expect(Math.abs(inside / n - 0.95)).toBeLessThan(5 * Math.sqrt((0.95 * 0.05) / n));
  });
});
