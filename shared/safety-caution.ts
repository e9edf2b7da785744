/**
 * The caution shown on findings, sign-off, stopping analysis and the evidence archive.
 * Kept in one place so every surface says the same thing.
 */
export const SAFETY_CAUTION =
  'Driftcase supports incident investigation with engineering estimates from recorded data. ' +
  'It does not replace a formal safety determination: final conclusions defer to local regulations, ' +
  'the applicable standards and licensed safety professionals.';
