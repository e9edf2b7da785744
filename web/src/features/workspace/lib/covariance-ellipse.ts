/**
 * Chi-square quantile with 2 degrees of freedom at 0.95: -2 ln(0.05) = 5.991 (closed form, since
 * the chi-square CDF with 2 dof is 1 - exp(-x/2)).
 */
export const CHI2_2DOF_95 = -2 * Math.log(0.05);

/**
 * Semi-axes (m) and orientation (rad, from the map x axis) of the 95 % confidence ellipse of a
 * 2-D Gaussian with covariance [[xx, xy], [xy, yy]] (m^2): the eigen-decomposition of the matrix,
 * each axis scaled by sqrt(chi2_2(0.95)). Returns null for a non-finite or non-positive matrix.
 */
export function confidenceEllipse(
  xx: number,
  xy: number,
  yy: number,
  quantile = CHI2_2DOF_95,
): { major: number; minor: number; angle: number } | null {
  if (![xx, xy, yy].every(Number.isFinite)) return null;
  const mean = (xx + yy) / 2;
  const spread = Math.sqrt(((xx - yy) / 2) ** 2 + xy * xy);
  const large = mean + spread;
  const small = mean - spread;
  if (!(large > 0) || small < -1e-12) return null;
  const angle = 0.5 * Math.atan2(2 * xy, xx - yy);
  return { major: Math.sqrt(large * quantile), minor: Math.sqrt(Math.max(0, small) * quantile), angle };
}
