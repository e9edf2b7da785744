/**
 * exp(x) for the filter's hot loops (weights, association terms), table-driven after Tang,
 * "Table-driven implementation of the exponential function in IEEE floating-point arithmetic"
 * (ACM TOMS 15(2), 1989): x = (256 m + j) ln2 / 256 + r with |r| <= ln2 / 512, so
 * exp(x) = 2^m 2^(j/256) e^r, e^r by its Taylor polynomial to r^5 (next term < 9e-21 relative).
 * Only double additions and multiplications, so every engine gives the same bits.
 *
 * Error bound: the 256 table entries 2^(j/256) come from the fdlibm port (< 1 ulp); reduction
 * and polynomial add < 1 ulp, so the result is within 2 ulp of e^x (tested against the stdlib
 * port and Math.exp over [-708, 709]). Outside (-708, 709), and for NaN, the fdlibm port itself
 * answers (underflow to subnormals or 0, overflow to Infinity).
 */
import { POW2, POW2_OFFSET } from './powers-of-two';
import { referenceExp } from './reference-functions';

const TABLE_BITS = 8;
const TABLE_SIZE = 1 << TABLE_BITS;
const N_OVER_LN2 = TABLE_SIZE / Math.LN2;
/**
 * ln2 / 256 as HIGH + LOW from fdlibm's split of ln2 (e_exp.c: ln2HI has 32 significant bits,
 * ln2LO the rest), so k * HIGH is exact for |k| < 2^21 and the reduction error stays below 2^-80.
 */
const HIGH = 0.6931471803691238 / TABLE_SIZE;
const LOW = 1.9082149292705877e-10 / TABLE_SIZE;

/** 2^(j / 256), j = 0..255. */
const TWO_POW_J = new Float64Array(TABLE_SIZE);
for (let j = 0; j < TABLE_SIZE; j++) TWO_POW_J[j] = referenceExp(j * HIGH + j * LOW);

export function exp(x: number): number {
  if (!(x > -708 && x < 709)) return referenceExp(x);
  const k = Math.round(x * N_OVER_LN2);
  const r = x - k * HIGH - k * LOW;
  const j = k & (TABLE_SIZE - 1);
  const m = (k - j) / TABLE_SIZE;
  const p = r + r * r * (0.5 + r * (1 / 6 + r * (1 / 24 + r * (1 / 120))));
  const t = TWO_POW_J[j];
  return (t + t * p) * POW2[m + POW2_OFFSET];
}
