import { range, scaleLinear } from 'd3';
import { describe, expect, it } from 'vitest';
import {
  clampDomain,
  createTimeScale,
  nearestStep,
  stepsInDomain,
} from '../../../../web/src/features/workspace/lib/time-scale';

describe('timeline time scale', () => {
  it('maps time to pixels exactly as d3.scaleLinear does, and back', () => {
    // Reference: d3-scale scaleLinear (d3 7, npm).
    const reference = scaleLinear().domain([12.5, 97.25]).range([40, 1010]);
    const scale = createTimeScale({ start: 12.5, end: 97.25 }, 40, 1010);
    for (const t of [12.5, 13, 50.125, 97.25, 0, 120]) {
      expect(scale.toPx(t)).toBeCloseTo(reference(t), 9);
      expect(scale.toTime(reference(t))).toBeCloseTo(t, 9);
    }
  });

  it('widens a zero-length domain so a single step still has a place', () => {
    const scale = createTimeScale({ start: 4, end: 4 }, 0, 100);
    expect(scale.toPx(4)).toBeCloseTo(50, 9);
  });

  it('finds the nearest step like a brute-force search over all steps', () => {
    // common practice: binary search must agree with the linear scan it replaces.
    const times = range(0, 600, 0.1).map((t) => Math.round(t * 1000) / 1000 + (t > 300 ? 2 : 0));
    for (const t of [-1, 0, 0.04, 0.05, 0.06, 299.97, 301, 301.5, 700]) {
      let best = 0;
      for (let k = 1; k < times.length; k++) if (Math.abs(times[k] - t) < Math.abs(times[best] - t)) best = k;
      expect(nearestStep(times, t)).toBe(best);
    }
    expect(nearestStep([], 3)).toBe(-1);
  });

  it('draws only the steps in view plus one neighbour each side', () => {
    const times = range(0, 100, 1);
    expect(stepsInDomain(times, { start: 10, end: 20 })).toEqual({ from: 9, to: 22 });
  });

  it('keeps a brushed zoom inside the replay and at least the minimum width', () => {
    const full = { start: 0, end: 60 };
    expect(clampDomain({ start: 50, end: 80 }, full)).toEqual({ start: 50, end: 60 });
    expect(clampDomain({ start: 30, end: 10 }, full)).toEqual({ start: 10, end: 30 });
    const narrow = clampDomain({ start: 20, end: 20.1 }, full, 2);
    expect(narrow.end - narrow.start).toBeCloseTo(2, 9);
  });
});
