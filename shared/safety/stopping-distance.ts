/**
 * Stopping distance of a robot travelling at speed v: it covers v * t_r during its reaction time,
 * then brakes at constant deceleration a over v^2 / (2a) (uniform deceleration kinematics; common
 * practice). A braking margin is added on top because real brakes, loads and floors vary: the
 * default +10 % is vendor practice with no single published source.
 */

/** Default braking margin as a fraction of the stopping distance (vendor practice, no single source). */
export const DEFAULT_BRAKING_MARGIN = 0.1;

export interface StoppingTerms {
  /** m/s, magnitude of the travel speed */
  speed: number;
  /** s */
  reactionTime: number;
  /** m/s^2, > 0 */
  deceleration: number;
  /** Fraction added to the distance (0.1 = +10 %). */
  brakingMargin: number;
}

export interface StoppingBreakdown {
  /** m, v * t_r */
  reaction: number;
  /** m, v^2 / (2a) */
  braking: number;
  /** m, reaction + braking, before the margin */
  base: number;
  /** m, base * (1 + margin) */
  total: number;
  /** s, t_r + v / a */
  time: number;
}

export function stoppingDistance(terms: StoppingTerms): StoppingBreakdown {
  const v = Math.abs(terms.speed);
  const reaction = v * terms.reactionTime;
  const braking = (v * v) / (2 * terms.deceleration);
  const base = reaction + braking;
  return {
    reaction,
    braking,
    base,
    total: base * (1 + terms.brakingMargin),
    time: terms.reactionTime + v / terms.deceleration,
  };
}
