/**
 * The engine's own elementary functions against references: the stdlib project's ports of
 * FreeBSD msun / fdlibm (npm @stdlib/math-base-special-*, documented within 1 ulp) and the
 * host's Math.* (V8: also fdlibm-derived). Bounds are the ones documented in each file.
 */
import stdlibAtan from '@stdlib/math-base-special-atan';
import stdlibCos from '@stdlib/math-base-special-cos';
import stdlibExp from '@stdlib/math-base-special-exp';
import stdlibLn from '@stdlib/math-base-special-ln';
import stdlibSin from '@stdlib/math-base-special-sin';
import { describe, expect, it } from 'vitest';
import { cos, exp, hypot, log, sin, sinCos } from '../../../shared/engine/numerics';
import { SMALL_ATAN_LIMIT, smallAtan } from '../../../shared/engine/numerics/small-atan';

/** Spacing of doubles at |v| (ulp), from its binary exponent. */
function ulp(v: number): number {
  const a = Math.abs(v);
  if (a < 2.2250738585072014e-308) return Number.MIN_VALUE;
  return 2 ** (Math.floor(Math.log2(a)) - 52);
}

/** Deterministic uniform numbers in [0, 1) (a 32-bit LCG, common practice). */
function uniforms(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    return state / 4294967296;
  };
}

describe('engine numerics', () => {
  it('smallAtan gives the bits of the Cephes atan port on [-0.66, 0.66], within 1 ulp of Math.atan', () => {
    const next = uniforms(7);
    let worst = 0;
    let compared = 0;
    const check = (x: number) => {
      const value = smallAtan(x);
      // Equal as numbers: the only difference allowed is the sign of a zero result, which squares away.
      if (value !== stdlibAtan(x)) expect({ x, value }).toEqual({ x, value: stdlibAtan(x) });
      worst = Math.max(worst, Math.abs(value - Math.atan(x)) / ulp(value || Number.MIN_VALUE));
      compared++;
    };
    for (let n = 0; n < 300_000; n++) {
      const u = 2 * next() - 1;
      check(n % 3 === 0 ? u * SMALL_ATAN_LIMIT : u * 10 ** (-1 - 15 * next()));
    }
    for (const x of [0, -0, SMALL_ATAN_LIMIT, -SMALL_ATAN_LIMIT, 0.3, 1e-300, Number.MIN_VALUE]) check(x);
    expect(compared).toBe(300_007);
    expect(worst).toBeLessThanOrEqual(1);
  });

  it('exp is within 2 ulp of the fdlibm port and of Math.exp over [-708, 709]', () => {
    const next = uniforms(1);
    let worst = 0;
    for (let n = 0; n < 300_000; n++) {
      const x = n % 3 === 0 ? -708 + 1417 * next() : -20 + 40 * next();
      const value = exp(x);
      worst = Math.max(
        worst,
        Math.abs(value - stdlibExp(x)) / ulp(value),
        Math.abs(value - Math.exp(x)) / ulp(value),
      );
    }
    expect(worst).toBeLessThanOrEqual(2);
    expect(exp(0)).toBe(1);
    expect(exp(1)).toBe(Math.E);
    expect(exp(-800)).toBe(0);
    expect(exp(710)).toBe(Number.POSITIVE_INFINITY);
    expect(exp(Number.NEGATIVE_INFINITY)).toBe(0);
    expect(exp(Number.NaN)).toBeNaN();
    expect(exp(-740)).toBe(stdlibExp(-740)); // subnormal result
  });

  it('log is within 3e-16 absolute (2 ulp above magnitude 1) of the fdlibm port and Math.log', () => {
    const next = uniforms(2);
    let worst = 0;
    for (let n = 0; n < 300_000; n++) {
      const x = n % 2 === 0 ? stdlibExp(-700 + 1400 * next()) : 0.5 + 3 * next();
      const value = log(x);
      const bound = Math.max(3e-16, 2 * ulp(value));
      worst = Math.max(worst, Math.abs(value - stdlibLn(x)) / bound, Math.abs(value - Math.log(x)) / bound);
    }
    expect(worst).toBeLessThanOrEqual(1);
    expect(log(1)).toBe(0);
    expect(log(Math.E)).toBe(1);
    expect(log(10)).toBe(Math.LN10);
    expect(log(0)).toBe(Number.NEGATIVE_INFINITY);
    expect(log(-1)).toBeNaN();
    expect(log(5e-324)).toBe(stdlibLn(5e-324));
  });

  it('sin and cos are within 2.5e-16 absolute of the fdlibm ports and Math.sin / Math.cos', () => {
    const next = uniforms(3);
    const out = new Float64Array(2);
    let worst = 0;
    for (let n = 0; n < 300_000; n++) {
      const x = n % 5 === 0 ? -1e5 + 2e5 * next() : -8 + 16 * next();
      sinCos(x, out);
      worst = Math.max(
        worst,
        Math.abs(out[0] - stdlibSin(x)),
        Math.abs(out[1] - stdlibCos(x)),
        Math.abs(out[0] - Math.sin(x)),
        Math.abs(out[1] - Math.cos(x)),
      );
    }
    expect(worst).toBeLessThanOrEqual(2.5e-16);
    // Exact quadrant handling at the reduction boundaries and for tiny arguments.
    expect(sin(0)).toBe(0);
    expect(cos(0)).toBe(1);
    expect(sin(1e-300)).toBe(1e-300);
    expect(sin(Math.PI / 6)).toBeCloseTo(0.5, 15);
    expect(cos(Math.PI)).toBe(-1);
    // Huge arguments go to the full reduction of the fdlibm port.
    expect(sin(1e22)).toBe(stdlibSin(1e22));
    expect(cos(Number.POSITIVE_INFINITY)).toBeNaN();
  });

  it('hypot is within 2 ulp of Math.hypot for engine-sized inputs', () => {
    const next = uniforms(4);
    for (let n = 0; n < 10_000; n++) {
      const [a, b] = [-100 + 200 * next(), -100 + 200 * next()];
      const value = hypot(a, b);
      expect(Math.abs(value - Math.hypot(a, b))).toBeLessThanOrEqual(2 * ulp(value));
    }
    expect(hypot(3, 4)).toBe(5);
  });
});
