/**
 * Standard normal deviates by the ziggurat method (Marsaglia & Tsang, "The ziggurat method for
 * generating random variables", J. Stat. Software 5(8), 2000), 256 layers, in the formulation of
 * Doornik, "An improved ziggurat method to generate normal random samples" (2005): the layer and
 * the value come from independent bits, and a wedge or the tail falls back to exact rejection.
 * About 98.8 % of draws take the fast path: one multiply and one comparison, no logarithm, no
 * trigonometry (Box–Muller needs a log, a square root and a cos/sin pair per two deviates).
 *
 * Counter-based like the rest of the engine: the fast path reads a value word and a layer byte
 * the caller got from a Philox block; a slow path fetches further Philox blocks keyed by
 * (fallback block, particle, step, purpose) with fallback block = (deviate + 1) * 2^16 + attempt,
 * so every deviate depends only on its own counters, never on other particles or on threads.
 * Tables use the engine's exp/log/sqrt, so they are the same bits on every engine.
 */
import { exp, log } from './numerics';
import { philox4x32, uniformFromWord } from './random';

const LAYERS = 256;
/** Marsaglia & Tsang's constants for 256 layers: the base strip's right edge and the common area. */
export const ZIGGURAT_R = 3.6541528853610088;
const AREA = 4.92867323399e-3;

const density = (x: number) => exp(-0.5 * x * x);

/** Layer right edges X[0..256]: X[0] = AREA / f(R) (the base strip's virtual width), X[1] = R, X[256] = 0. */
const EDGE = new Float64Array(LAYERS + 1);
/** X[i + 1] / X[i]: |u| below it lies inside the layer's rectangle under the curve. */
const INNER_RATIO = new Float64Array(LAYERS);
EDGE[0] = AREA / density(ZIGGURAT_R);
EDGE[1] = ZIGGURAT_R;
for (let i = 2; i < LAYERS; i++) EDGE[i] = Math.sqrt(-2 * log(AREA / EDGE[i - 1] + density(EDGE[i - 1])));
EDGE[LAYERS] = 0;
for (let i = 0; i < LAYERS; i++) INNER_RATIO[i] = EDGE[i + 1] / EDGE[i];

/** Signed uniform in (-1, 1) with 32-bit resolution: 2 (word + 0.5) / 2^32 - 1. */
const SIGNED_SCALE = 1 / 2147483648;
export function signedUniformFromWord(word: number): number {
  return (word + 0.5) * SIGNED_SCALE - 1;
}

/**
 * The deviate for a value word and a layer byte (0..255); the counters and `words` (4 words of
 * scratch, not the caller's block) serve the slow path. The fast path is small so it inlines.
 */
export function zigguratNormal(
  valueWord: number,
  layer: number,
  deviate: number,
  particle: number,
  step: number,
  purpose: number,
  keyLow: number,
  keyHigh: number,
  words: Uint32Array,
): number {
  const u = (valueWord + 0.5) * SIGNED_SCALE - 1;
  if (Math.abs(u) < INNER_RATIO[layer]) return u * EDGE[layer];
  return zigguratSlowPath(u, layer, deviate, particle, step, purpose, keyLow, keyHigh, words);
}

/** Rejection in the wedge or the tail, drawing further Philox blocks until a deviate is accepted. */
function zigguratSlowPath(
  firstU: number,
  firstLayer: number,
  deviate: number,
  particle: number,
  step: number,
  purpose: number,
  keyLow: number,
  keyHigh: number,
  words: Uint32Array,
): number {
  const blockBase = (deviate + 1) * 65536;
  let attempt = 0;
  let u = firstU;
  let layer = firstLayer;
  for (;;) {
    if (Math.abs(u) < INNER_RATIO[layer]) return u * EDGE[layer];
    if (layer === 0) {
      // Tail beyond R (Marsaglia 1964): x = -ln(U1) / R, accept when -2 ln(U2) > x^2.
      for (;;) {
        philox4x32(blockBase + attempt++, particle, step, purpose, keyLow, keyHigh, words);
        const x = -log(uniformFromWord(words[0])) / ZIGGURAT_R;
        const y = -log(uniformFromWord(words[1]));
        if (2 * y > x * x) return u < 0 ? -(ZIGGURAT_R + x) : ZIGGURAT_R + x;
      }
    }
    philox4x32(blockBase + attempt++, particle, step, purpose, keyLow, keyHigh, words);
    // Wedge: a uniform point in the layer's rectangle beyond the inner part, kept if under the curve.
    const x = u * EDGE[layer];
    const outer = exp(-0.5 * (EDGE[layer] * EDGE[layer] - x * x));
    const inner = exp(-0.5 * (EDGE[layer + 1] * EDGE[layer + 1] - x * x));
    if (inner + uniformFromWord(words[2]) * (outer - inner) < 1) return x;
    u = signedUniformFromWord(words[0]);
    layer = words[1] & 0xff;
  }
}
