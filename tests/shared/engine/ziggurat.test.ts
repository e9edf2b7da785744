/**
 * The ziggurat sampler against the normal distribution: sample moments within 4 standard errors
 * (mean 0, variance 1, skewness 0, excess kurtosis 0; standard errors sqrt(1/n), sqrt(2/n),
 * sqrt(6/n), sqrt(24/n) for normal samples, common practice), and the Kolmogorov–Smirnov
 * statistic against the normal CDF of the jstat reference library below the 1 % critical value
 * 1.628 / sqrt(n) (Kolmogorov's asymptotic distribution, e.g. NIST/SEMATECH e-Handbook 1.3.5.16).
 * The tail path on its own is checked against the normal tail beyond R the same way.
 */
import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import { philox4x32, RNG_PURPOSE } from '../../../shared/engine/random';
import { ZIGGURAT_R, zigguratNormal } from '../../../shared/engine/ziggurat';

const KS_CRITICAL_1_PERCENT = 1.628;

function kolmogorovSmirnov(samples: Float64Array, cdf: (x: number) => number): number {
  const sorted = Float64Array.from(samples).sort();
  const n = sorted.length;
  let d = 0;
  for (let i = 0; i < n; i++) {
    const f = cdf(sorted[i]);
    d = Math.max(d, (i + 1) / n - f, f - i / n);
  }
  return d;
}

/** Deviates drawn the way the motion model draws them: three per Philox block, layers from word 3. */
function motionStyleDeviates(blocks: number): Float64Array {
  const words = new Uint32Array(4);
  const spare = new Uint32Array(4);
  const out = new Float64Array(3 * blocks);
  const purpose = RNG_PURPOSE.test;
  for (let i = 0; i < blocks; i++) {
    philox4x32(0, i, 7, purpose, 1234, 0, words);
    const layers = words[3];
    for (let k = 0; k < 3; k++)
      out[3 * i + k] = zigguratNormal(
        words[k],
        (layers >>> (8 * k)) & 0xff,
        k,
        i,
        7,
        purpose,
        1234,
        0,
        spare,
      );
  }
  return out;
}

describe('ziggurat normal sampler', () => {
  const samples = motionStyleDeviates(200_000);
  const n = samples.length;

  it('has the moments of a standard normal', () => {
    let mean = 0;
    for (const v of samples) mean += v;
    mean /= n;
    let m2 = 0;
    let m3 = 0;
    let m4 = 0;
    for (const v of samples) {
      const d = v - mean;
      m2 += d * d;
      m3 += d * d * d;
      m4 += d * d * d * d;
    }
    m2 /= n;
    m3 /= n;
    m4 /= n;
    expect(Math.abs(mean)).toBeLessThan(4 * Math.sqrt(1 / n));
    expect(Math.abs(m2 - 1)).toBeLessThan(4 * Math.sqrt(2 / n));
    expect(Math.abs(m3 / m2 ** 1.5)).toBeLessThan(4 * Math.sqrt(6 / n));
    expect(Math.abs(m4 / (m2 * m2) - 3)).toBeLessThan(4 * Math.sqrt(24 / n));
  });

  it('passes a Kolmogorov–Smirnov test against the normal CDF', () => {
    const d = kolmogorovSmirnov(samples, (x) => jStat.normal.cdf(x, 0, 1));
    expect(d).toBeLessThan(KS_CRITICAL_1_PERCENT / Math.sqrt(n));
  });

  it('puts the expected share of deviates beyond the base strip, |x| > R', () => {
    // P(|x| > R) = 2 (1 - Phi(R)), about 2.6e-4; binomial count within 4 standard deviations.
    const p = 2 * (1 - jStat.normal.cdf(ZIGGURAT_R, 0, 1));
    const count = samples.filter((v) => Math.abs(v) > ZIGGURAT_R).length;
    expect(Math.abs(count - n * p)).toBeLessThan(4 * Math.sqrt(n * p * (1 - p)));
  });

  it('samples the tail beyond R from the normal tail distribution', () => {
    // u close to 1 in the base layer always takes the tail path.
    const spare = new Uint32Array(4);
    const tail = new Float64Array(20_000);
    for (let i = 0; i < tail.length; i++)
      tail[i] = zigguratNormal(0xffffffff, 0, 0, i, 3, RNG_PURPOSE.test, 99, 0, spare);
    expect(Math.min(...tail)).toBeGreaterThan(ZIGGURAT_R);
    const beyond = 1 - jStat.normal.cdf(ZIGGURAT_R, 0, 1);
    const d = kolmogorovSmirnov(tail, (x) => (jStat.normal.cdf(x, 0, 1) - (1 - beyond)) / beyond);
    expect(d).toBeLessThan(KS_CRITICAL_1_PERCENT / Math.sqrt(tail.length));
  });

  it('depends only on its own counters', () => {
    const spare = new Uint32Array(4);
    const a = zigguratNormal(0xfff00000, 200, 1, 5, 9, RNG_PURPOSE.test, 1, 0, spare);
    spare.fill(12345);
    const b = zigguratNormal(0xfff00000, 200, 1, 5, 9, RNG_PURPOSE.test, 1, 0, spare);
    expect(b).toBe(a);
  });
});
