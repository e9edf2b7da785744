/**
 * Small numeric helpers shared by the models and the diagnostics. Pure functions on numbers and
 * typed arrays; angles in radians.
 */
import { exp, log } from './numerics';

const LOG_SQRT_TWO_PI = 0.5 * log(2 * Math.PI);
const TWO_PI = 2 * Math.PI;

/** Wraps an angle (rad) to (-pi, pi]. */
export function wrapAngle(angle: number): number {
  let wrapped = angle - TWO_PI * Math.floor((angle + Math.PI) / TWO_PI);
  // floor() maps exactly +pi to -pi; the bundle format uses (-pi, pi].
  if (wrapped <= -Math.PI) wrapped += TWO_PI;
  return wrapped;
}

/** log of the normal density N(x; mean, sigma), sigma > 0 (same unit as x). */
export function normalLogDensity(x: number, mean: number, sigma: number): number {
  const z = (x - mean) / sigma;
  return -0.5 * z * z - log(sigma) - LOG_SQRT_TWO_PI;
}

/** Normal density N(x; mean, sigma). */
export function normalDensity(x: number, mean: number, sigma: number): number {
  return exp(normalLogDensity(x, mean, sigma));
}

/** log(sum(exp(values[0..count)))) computed stably; -Infinity for an empty or all -Infinity input. */
export function logSumExp(values: Float64Array, count: number = values.length): number {
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < count; i++) if (values[i] > max) max = values[i];
  if (max === Number.NEGATIVE_INFINITY || Number.isNaN(max)) return max;
  let sum = 0;
  for (let i = 0; i < count; i++) sum += exp(values[i] - max);
  return max + log(sum);
}

/**
 * Standard normal quantile (inverse CDF), Acklam's rational approximation refined by one Halley
 * step against an erfc-based CDF (relative error below 1e-9 over (0, 1)).
 */
export function normalQuantile(p: number): number {
  if (!(p > 0 && p < 1)) {
    if (p === 0) return Number.NEGATIVE_INFINITY;
    if (p === 1) return Number.POSITIVE_INFINITY;
    return Number.NaN;
  }
  const a = [
    -39.69683028665376, 220.9460984245205, -275.9285104469687, 138.357751867269, -30.66479806614716,
    2.506628277459239,
  ];
  const b = [
    -54.47609879822406, 161.5858368580409, -155.6989798598866, 66.80131188771972, -13.28068155288572,
  ];
  const c = [
    -0.007784894002430293, -0.3223964580411365, -2.400758277161838, -2.549732539343734, 4.374664141464968,
    2.938163982698783,
  ];
  const d = [0.007784695709041462, 0.3224671290700398, 2.445134137142996, 3.754408661907416];
  const pLow = 0.02425;
  let x: number;
  if (p < pLow) {
    const q = Math.sqrt(-2 * log(p));
    x =
      (((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  } else if (p <= 1 - pLow) {
    const q = p - 0.5;
    const r = q * q;
    x =
      ((((((a[0] * r + a[1]) * r + a[2]) * r + a[3]) * r + a[4]) * r + a[5]) * q) /
      (((((b[0] * r + b[1]) * r + b[2]) * r + b[3]) * r + b[4]) * r + 1);
  } else {
    const q = Math.sqrt(-2 * log(1 - p));
    x =
      -(((((c[0] * q + c[1]) * q + c[2]) * q + c[3]) * q + c[4]) * q + c[5]) /
      ((((d[0] * q + d[1]) * q + d[2]) * q + d[3]) * q + 1);
  }
  const error = 0.5 * erfc(-x / Math.SQRT2) - p;
  const u = error * Math.sqrt(2 * Math.PI) * exp((x * x) / 2);
  return x - u / (1 + (x * u) / 2);
}

/** Complementary error function (Numerical Recipes' Chebyshev fit, |relative error| < 1.2e-7, then refined use is tolerant). */
export function erfc(x: number): number {
  const z = Math.abs(x);
  const t = 1 / (1 + 0.5 * z);
  const r =
    t *
    exp(
      -z * z -
        1.26551223 +
        t *
          (1.00002368 +
            t *
              (0.37409196 +
                t *
                  (0.09678418 +
                    t *
                      (-0.18628806 +
                        t *
                          (0.27886807 +
                            t * (-1.13520398 + t * (1.48851587 + t * (-0.82215223 + t * 0.17087277)))))))),
    );
  return x >= 0 ? r : 2 - r;
}

/**
 * Chi-square quantile for `dof` degrees of freedom at probability p in (0, 1).
 * Exact for dof 2 (-2 ln(1 - p)); for dof 3 the closed-form survival function
 * S(x) = erfc(sqrt(x/2)) + sqrt(2x/pi) exp(-x/2) is inverted by Newton's method; other dof use the
 * Wilson–Hilferty cube approximation (Wilson & Hilferty 1931), about 0.1 % at the upper tail.
 */
export function chiSquareQuantile(p: number, dof: number): number {
  if (dof === 2) return -2 * log(1 - p);
  const z = normalQuantile(p);
  const h = 2 / (9 * dof);
  const cube = 1 - h + z * Math.sqrt(h);
  const approximate = dof * cube * cube * cube;
  if (dof !== 3) return approximate;
  let x = approximate;
  for (let iteration = 0; iteration < 30; iteration++) {
    const survival = erfc(Math.sqrt(x / 2)) + Math.sqrt((2 * x) / Math.PI) * exp(-x / 2);
    const density = (Math.sqrt(x) * exp(-x / 2)) / Math.sqrt(2 * Math.PI);
    const next = x + (survival - (1 - p)) / density;
    if (Math.abs(next - x) < 1e-12 * x) return next;
    x = next;
  }
  return x;
}

/** Shannon entropy -sum(w ln w) in nats of normalised weights w[0..count). */
export function weightEntropy(weights: Float64Array, count: number): number {
  let entropy = 0;
  for (let i = 0; i < count; i++) {
    const w = weights[i];
    if (w > 0) entropy -= w * log(w);
  }
  return entropy;
}
