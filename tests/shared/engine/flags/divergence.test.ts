import { describe, expect, it } from 'vitest';
import { findDivergenceTime } from '../../../../shared/engine/divergence';

const t = Float64Array.from({ length: 100 }, (_, k) => k / 10);

describe('findDivergenceTime', () => {
  it('returns the start of the first stretch above 0.5 m lasting 2 s', () => {
    const error = new Float64Array(100).fill(0.05);
    for (let k = 20; k < 25; k++) error[k] = 0.9; // 0.4 s excursion: not a divergence
    for (let k = 40; k < 70; k++) error[k] = 0.6;
    expect(findDivergenceTime(t, error)).toBeCloseTo(4, 9);
  });

  it('is null when the stretch is too short, never happens, or there is no reference', () => {
    const error = new Float64Array(100).fill(0.05);
    for (let k = 40; k < 59; k++) error[k] = 0.6; // 1.8 s
    expect(findDivergenceTime(t, error)).toBeNull();
    expect(findDivergenceTime(t, new Float64Array(100).fill(0.1))).toBeNull();
    expect(findDivergenceTime(t, new Float64Array(100).fill(Number.NaN))).toBeNull();
  });

  it('restarts the stretch after a missing reference value', () => {
    const error = new Float64Array(100).fill(0.9);
    error[15] = Number.NaN;
    expect(findDivergenceTime(t, error)).toBeCloseTo(1.6, 9);
  });
});
