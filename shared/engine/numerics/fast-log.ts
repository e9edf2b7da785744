/**
 * Natural logarithm for the filter's hot loops, table-driven (the method of Tang, "Table-driven
 * implementation of the logarithm function in IEEE floating-point arithmetic", ACM TOMS 16(4),
 * 1990): x = 2^e m with m in [1, 2); c = 1 + (j + 0.5) / 128 from the top 7 bits of m, so
 * log x = e ln2 + log c + log1p(r) with r = (m - c) / c, |r| < 1/257; log1p(r) by its Taylor
 * polynomial to r^7 (next term below 1e-20). m - c is exact (Sterbenz), r is rounded twice
 * (relative error below 2^-52, harmless at |r| < 1/257); only double additions and
 * multiplications are used, so every engine gives the same bits.
 *
 * Error bound: table entries log c from the fdlibm port (< 1 ulp), e ln2 split exactly, the
 * sum adds < 1.5 ulp: within 3e-16 absolute for results of magnitude below 1 and 2 ulp above
 * (tested against the stdlib port and Math.log). Near 1 (|x - 1| < 1/16), where that absolute
 * error would be a large relative one, for zero, negatives, subnormals, Infinity and NaN, the
 * fdlibm port answers.
 */
import { POW2, POW2_OFFSET } from './powers-of-two';
import { referenceLog } from './reference-functions';

const TABLE_BITS = 7;
const TABLE_SIZE = 1 << TABLE_BITS;
/** fdlibm's split of ln 2 (e_log.c): LN2_HIGH has 32 significant bits, so e * LN2_HIGH is exact. */
const LN2_HIGH = 0.6931471803691238;
const LN2_LOW = 1.9082149292705877e-10;
const SMALLEST_NORMAL = 2.2250738585072014e-308;

const CENTRE = new Float64Array(TABLE_SIZE);
const INVERSE_CENTRE = new Float64Array(TABLE_SIZE);
const LOG_CENTRE = new Float64Array(TABLE_SIZE);
for (let j = 0; j < TABLE_SIZE; j++) {
  CENTRE[j] = 1 + (j + 0.5) / TABLE_SIZE;
  INVERSE_CENTRE[j] = 1 / CENTRE[j];
  LOG_CENTRE[j] = referenceLog(CENTRE[j]);
}

const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);
/** Index of the high word of a float64 in `words` on this machine's byte order. */
const HIGH_WORD = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;

export function log(x: number): number {
  if (!(x >= SMALLEST_NORMAL && x < Number.POSITIVE_INFINITY) || (x > 0.9375 && x < 1.0625))
    return referenceLog(x);
  bits[0] = x;
  const high = words[HIGH_WORD];
  const e = (high >>> 20) - 1023;
  const j = (high >>> (20 - TABLE_BITS)) & (TABLE_SIZE - 1);
  // Scaling by 2^-e is exact; rewriting the exponent bits instead stalls the store-to-load path.
  const m = x * POW2[POW2_OFFSET - e];
  const r = (m - CENTRE[j]) * INVERSE_CENTRE[j];
  const r2 = r * r;
  const p = r - r2 * (0.5 - r * (1 / 3 - r * (0.25 - r * (0.2 - r * (1 / 6 - r * (1 / 7))))));
  return e * LN2_HIGH + LOG_CENTRE[j] + (p + e * LN2_LOW);
}
