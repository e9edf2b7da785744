/**
 * Replay digest: SHA-256 over the per-step filter outputs in a canonical byte layout, so two
 * replays can be compared by one string.
 *
 * Layout (all little-endian):
 *   header: the 26 ASCII bytes "driftcase-replay-digest/<DIGEST_LAYOUT>\n" (layout 2 today, see
 *   engine-version.ts), then uint32 step count;
 *   per step, in step order:
 *     float64 t, x, y, theta, cov_xx, cov_xy, cov_yy, cov_tt, ess, entropy, log_likelihood
 *     uint8   resampled (method code, 0 = none)
 *     uint32  distinct, injected, particles, clusters
 * Every NaN is written as the canonical quiet NaN 0x7FF8000000000000.
 * Errors against reference/onboard poses are NOT included: they depend on other files, not the filter.
 */

import { DIGEST_LAYOUT } from './engine-version';
import type { ReplaySeries } from './replay-series';
import { sha256Hex } from './sha256';

const HEADER = `driftcase-replay-digest/${DIGEST_LAYOUT}\n`;
const FLOAT_FIELDS = [
  't',
  'x',
  'y',
  'theta',
  'cov_xx',
  'cov_xy',
  'cov_yy',
  'cov_tt',
  'ess',
  'entropy',
  'log_likelihood',
] as const;
const INTEGER_FIELDS = ['distinct', 'injected', 'particles', 'clusters'] as const;
/** Bytes per step in the canonical layout. */
export const DIGEST_BYTES_PER_STEP = FLOAT_FIELDS.length * 8 + 1 + INTEGER_FIELDS.length * 4;

/** Canonical bytes of the first `steps` steps of `series`. */
export function canonicalStepBytes(series: ReplaySeries, steps: number = series.t.length): Uint8Array {
  const bytes = new Uint8Array(HEADER.length + 4 + steps * DIGEST_BYTES_PER_STEP);
  const view = new DataView(bytes.buffer);
  for (let i = 0; i < HEADER.length; i++) bytes[i] = HEADER.charCodeAt(i);
  let offset = HEADER.length;
  view.setUint32(offset, steps, true);
  offset += 4;
  for (let k = 0; k < steps; k++) {
    for (const field of FLOAT_FIELDS) {
      const value = series[field][k];
      if (Number.isNaN(value)) {
        view.setUint32(offset, 0, true);
        view.setUint32(offset + 4, 0x7ff80000, true);
      } else {
        view.setFloat64(offset, value, true);
      }
      offset += 8;
    }
    view.setUint8(offset, series.resampled[k]);
    offset += 1;
    for (const field of INTEGER_FIELDS) {
      view.setUint32(offset, series[field][k], true);
      offset += 4;
    }
  }
  return bytes;
}

/** SHA-256 (hex) of the canonical layout of the series. */
export function replayDigest(series: ReplaySeries, steps: number = series.t.length): string {
  return sha256Hex(canonicalStepBytes(series, steps));
}
