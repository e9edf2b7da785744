import { describe, expect, it } from 'vitest';
import { cosSinOfWordTurn } from '../../../shared/engine/turn-trig';

describe('cos/sin of a random angle from a 32-bit word', () => {
  it('matches Math.cos and Math.sin of 2 pi (word + 0.5) / 2^32 to 1e-15', () => {
    // Reference: the defining formula evaluated with the platform's cos and sin (common practice).
    const out = new Float64Array(2);
    const words = [0, 1, 0x3fffff, 0x400000, 0x7fffffff, 0x80000000, 0xbfffffff, 0xfffffffe, 0xffffffff];
    let state = 99;
    for (let n = 0; n < 20_000; n++) {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      words.push(state);
    }
    let worst = 0;
    for (const word of words) {
      const angle = (2 * Math.PI * (word + 0.5)) / 4294967296;
      cosSinOfWordTurn(word, out);
      worst = Math.max(worst, Math.abs(out[0] - Math.cos(angle)), Math.abs(out[1] - Math.sin(angle)));
    }
    expect(worst).toBeLessThan(1e-15);
  });

  it('gives the same value for a word passed with its signed 32-bit bit pattern', () => {
    const unsigned = new Float64Array(2);
    const signed = new Float64Array(2);
    cosSinOfWordTurn(0xdeadbeef, unsigned);
    cosSinOfWordTurn(0xdeadbeef | 0, signed);
    expect(Array.from(signed)).toEqual(Array.from(unsigned));
  });
});
