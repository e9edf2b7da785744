import { describe, expect, it } from 'vitest';
import { DEFAULT_BRAKING_MARGIN, stoppingDistance } from '../../../shared/safety/stopping-distance';

describe('stopping distance d = v t_r + v^2 / (2a) plus a braking margin', () => {
  it('gives 1.275 m for v = 1.5 m/s, t_r = 0.1 s, a = 1.0 m/s^2 before the margin', () => {
    // Uniform deceleration kinematics (common practice): 1.5 * 0.1 + 1.5^2 / 2 = 0.15 + 1.125 = 1.275 m.
    const d = stoppingDistance({ speed: 1.5, reactionTime: 0.1, deceleration: 1.0, brakingMargin: 0 });
    expect(d.reaction).toBeCloseTo(0.15, 12);
    expect(d.braking).toBeCloseTo(1.125, 12);
    expect(d.base).toBeCloseTo(1.275, 12);
    // Time to stop t_r + v / a = 0.1 + 1.5 = 1.6 s (same kinematics).
    expect(d.time).toBeCloseTo(1.6, 12);
  });

  it('adds the default +10 % braking margin (vendor practice, no single source)', () => {
    expect(DEFAULT_BRAKING_MARGIN).toBe(0.1);
    const d = stoppingDistance({ speed: 1.5, reactionTime: 0.1, deceleration: 1.0, brakingMargin: 0.1 });
    // 1.275 m * 1.1 = 1.4025 m, by hand.
    expect(d.total).toBeCloseTo(1.4025, 12);
  });

  it('is the same backwards: a robot reversing at 1.5 m/s needs the same distance', () => {
    const d = stoppingDistance({ speed: -1.5, reactionTime: 0.1, deceleration: 1.0, brakingMargin: 0 });
    expect(d.base).toBeCloseTo(1.275, 12);
  });
});
