/**
 * Cosine and sine of a uniformly random angle given as a 32-bit word, for Box–Muller in the motion
 * noise: angle = 2 pi (word + 0.5) / 2^32. The top 10 bits pick an entry of a 1024-entry table of
 * cos/sin at multiples of 2 pi / 1024; the low 22 bits give the remainder d < 2 pi / 1024 ≈ 0.0061
 * rad, added by the angle-sum formulas with Taylor polynomials cos d ≈ 1 - d²/2 + d⁴/24 (next term
 * d⁶/720 < 8e-17) and sin d ≈ d - d³/6 + d⁵/120 (next term < 1e-19). Absolute error is about
 * 2e-16, where Math.cos plus Math.sin cost about three times as much in V8. The table is built once
 * from Math.cos/Math.sin and never changes, so results stay deterministic.
 */

const TABLE_BITS = 10;
const TABLE_SIZE = 1 << TABLE_BITS;
const TABLE_STEP = (2 * Math.PI) / TABLE_SIZE;
const REMAINDER_MASK = (1 << (32 - TABLE_BITS)) - 1;
/** rad per unit of a word read as a fraction of a full turn. */
const WORD_TO_RADIANS = (2 * Math.PI) / 4294967296;

const COS_TABLE = new Float64Array(TABLE_SIZE);
const SIN_TABLE = new Float64Array(TABLE_SIZE);
for (let j = 0; j < TABLE_SIZE; j++) {
  COS_TABLE[j] = Math.cos(j * TABLE_STEP);
  SIN_TABLE[j] = Math.sin(j * TABLE_STEP);
}

/**
 * Writes cos and sin of the angle 2 pi (word + 0.5) / 2^32 (rad) to out[0] and out[1]; `word` is
 * an unsigned (or same-bits signed) 32-bit integer.
 */
export function cosSinOfWordTurn(word: number, out: Float64Array): void {
  const j = word >>> (32 - TABLE_BITS);
  const d = ((word & REMAINDER_MASK) + 0.5) * WORD_TO_RADIANS;
  const d2 = d * d;
  const cosD = 1 - d2 * (0.5 - d2 * (1 / 24));
  const sinD = d * (1 - d2 * (1 / 6 - d2 * (1 / 120)));
  const c = COS_TABLE[j];
  const s = SIN_TABLE[j];
  out[0] = c * cosD - s * sinD;
  out[1] = s * cosD + c * sinD;
}
