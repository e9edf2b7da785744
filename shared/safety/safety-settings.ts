/**
 * Every tunable term of the separation and stopping analysis, with its default and where the
 * default comes from. All in metres, seconds and fractions.
 */
import { DEFAULT_HUMAN_SPEED } from './separation-formulas';
import { DEFAULT_BRAKING_MARGIN } from './stopping-distance';
import type { SpeedSource } from './travel-speed';

export interface SafetySettings {
  /** Added to the stopping distance as a fraction (vendor practice, no single source). */
  braking_margin: number;
  /** Where the travel speed comes from. */
  speed_source: SpeedSource;
  /** m: a scan return within this distance of the footprint counts as contact for the whole belief (our default). */
  contact_scan_margin: number;
  /**
   * m: the scans replace the map's clearance when they see something at least this much nearer
   * than the map shows (an object the map lacks); otherwise the map at the pose is used, which is
   * steadier than single returns (our default: several times the range noise of a safety scanner).
   */
  scan_override: number;
  /** m: clearance at or below this counts as contact when suggesting a class (our default: below the noise of the samples' reference survey). */
  contact_clearance: number;
  /** m: clearance below this around a stop suggests a near miss (our default). */
  near_miss_clearance: number;
  /** s: how far back from an event to look for the stopping margin turning negative. */
  lookback: number;
  /** m/s: ISO/TS 15066 human approach speed v_h when none was measured. */
  human_speed: number;
  /** m: ISO/TS 15066 intrusion distance C (depends on the sensor; placeholder, set per device). */
  intrusion: number;
  /** m: ISO/TS 15066 sensor uncertainty Z_d (placeholder, set per device). */
  sensor_uncertainty: number;
}

export const DEFAULT_SAFETY_SETTINGS: SafetySettings = {
  braking_margin: DEFAULT_BRAKING_MARGIN,
  speed_source: 'odometry',
  contact_scan_margin: 0.05,
  scan_override: 0.1,
  contact_clearance: 0.01,
  near_miss_clearance: 0.3,
  lookback: 5,
  human_speed: DEFAULT_HUMAN_SPEED,
  intrusion: 0.1,
  sensor_uncertainty: 0.1,
};

/** Chi-square quantile, 2 degrees of freedom, 95 % (= -2 ln 0.05 = 5.991; any chi-square table). */
export const CHI2_2DOF_95 = 5.991;
