/**
 * atan(x) for |x| <= 0.66 only: the branch of Cephes' atan (the stdlib port,
 * `@stdlib/math-base-special-atan`) that needs no range reduction, x + x z P(z) / Q(z) with
 * z = x^2, with Cephes' coefficients. Same operations in the same order, so the same bits as
 * the full function on that interval but for the sign of a zero result, which the squared
 * residual drops (tests/shared/engine/numerics.test.ts compares them),
 * without its sign, infinity and reduction branches: the association loop's bearing residuals
 * are gated far inside it (bearing gate about 0.3 rad for a 0.03 rad sigma).
 */
export const SMALL_ATAN_LIMIT = 0.66;

export function smallAtan(x: number): number {
  const z = x * x;
  const p =
    -64.85021904942025 +
    z *
      (-122.88666844901361 + z * (-75.00855792314705 + z * (-16.157537187333652 + z * -0.8750608600031904)));
  const q =
    194.5506571482614 +
    z *
      (485.3903996359137 +
        z * (432.88106049129027 + z * (165.02700983169885 + z * (24.858464901423062 + z))));
  return x * ((z * p) / q) + x;
}
