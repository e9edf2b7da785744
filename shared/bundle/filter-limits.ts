/**
 * Limits on the filter settings, shared by the bundle manifest (`filter` block) and the what-if
 * overrides of the CLI and API, so a value refused as an override is refused in a manifest too.
 */

/** Upper limit on the particle count (also KLD min/max), so a typo cannot exhaust memory. */
export const MAX_PARTICLES = 200_000;

/** Seeds are non-negative integers that JSON numbers carry exactly. */
export const MIN_SEED = 0;
export const MAX_SEED = Number.MAX_SAFE_INTEGER;
