/**
 * The separation formulas of two standards, shown for orientation only: check every term against
 * the current edition before relying on it. Inputs and outputs in metres and seconds (ISO 13855 in
 * millimetres, as the standard writes it).
 */

export const ISO_TS_15066_EDITION = 'ISO/TS 15066:2016, clause 5.5.4 (speed and separation monitoring)';
export const ISO_13855_EDITION =
  'ISO 13855:2010, clause 6 (general formula) and 6.2 (electro-sensitive protective equipment)';

/** Default human walking speed (m/s) when none was measured: the value ISO 13855 and ISO/TS 15066 use. */
export const DEFAULT_HUMAN_SPEED = 1.6;

export interface ProtectiveSeparationTerms {
  /** m/s, speed of the person towards the robot */
  humanSpeed: number;
  /** m/s, speed of the robot towards the person */
  robotSpeed: number;
  /** s, T_r: time for the robot system to react to the person's presence */
  reactionTime: number;
  /** s, T_s: time for the robot to stop */
  stoppingTime: number;
  /** m, S_s: distance the robot travels while stopping */
  stoppingDistance: number;
  /** m, C: intrusion distance (how far a body part reaches into the sensing field before it is detected) */
  intrusion: number;
  /** m, Z_d: position uncertainty of the person (sensor measurement tolerance) */
  sensorUncertainty: number;
  /** m, Z_r: position uncertainty of the robot */
  robotUncertainty: number;
}

export interface ProtectiveSeparation {
  /** m, S_h = v_h * (T_r + T_s) */
  humanTravel: number;
  /** m, S_r = v_r * T_r */
  robotReactionTravel: number;
  /** m, S_p = S_h + S_r + S_s + C + Z_d + Z_r */
  total: number;
}

/**
 * ISO/TS 15066:2016 protective separation distance with constant speeds over the stopping time:
 * S_p = v_h (T_r + T_s) + v_r T_r + S_s + C + Z_d + Z_r (clause 5.5.4, formula (1) simplified for
 * constant speeds; see also Marvel and Norcross 2017).
 */
export function protectiveSeparationDistance(terms: ProtectiveSeparationTerms): ProtectiveSeparation {
  const humanTravel = terms.humanSpeed * (terms.reactionTime + terms.stoppingTime);
  const robotReactionTravel = terms.robotSpeed * terms.reactionTime;
  return {
    humanTravel,
    robotReactionTravel,
    total:
      humanTravel +
      robotReactionTravel +
      terms.stoppingDistance +
      terms.intrusion +
      terms.sensorUncertainty +
      terms.robotUncertainty,
  };
}

export interface MinimumDistanceTerms {
  /** s, T: overall system stopping performance (device response plus machine stopping time) */
  stoppingPerformance: number;
  /** mm, d: detection capability (resolution) of the protective device */
  detectionCapability: number;
}

export interface MinimumDistance {
  /** mm/s, the approach speed K finally used */
  approachSpeed: number;
  /** mm, C = 8 (d - 14), not below 0 */
  intrusion: number;
  /** mm, S = K T + C */
  distance: number;
  /** mm, S with K = 2000 mm/s, before any recomputation */
  distanceAtK2000: number;
}

/**
 * ISO 13855:2010 minimum distance S = K T + C for an electro-sensitive device with detection
 * capability d <= 40 mm (C = 8 (d - 14) mm): K = 2000 mm/s; when that gives more than 500 mm,
 * recompute with K = 1600 mm/s but not below 500 mm. For 40 < d <= 70 mm the standard uses
 * K = 1600 mm/s and C = 850 mm (from memory of the standard; check the current edition).
 */
export function minimumDistance(terms: MinimumDistanceTerms): MinimumDistance {
  if (terms.detectionCapability > 40) {
    const distance = 1600 * terms.stoppingPerformance + 850;
    return { approachSpeed: 1600, intrusion: 850, distance, distanceAtK2000: distance };
  }
  const intrusion = Math.max(0, 8 * (terms.detectionCapability - 14));
  const fast = 2000 * terms.stoppingPerformance + intrusion;
  if (fast <= 500) return { approachSpeed: 2000, intrusion, distance: fast, distanceAtK2000: fast };
  const slow = 1600 * terms.stoppingPerformance + intrusion;
  return { approachSpeed: 1600, intrusion, distance: Math.max(500, slow), distanceAtK2000: fast };
}
