import { describe, expect, it } from 'vitest';
import { COLLAPSE_ESS_FRACTION, detectBeliefCollapse } from '../../../../shared/engine/flags/belief-collapse';
import { makeHealthySeries, PARTICLES, stepAt } from './synthetic-series';

describe('detectBeliefCollapse', () => {
  it('flags repeated near-degenerate weights close together', () => {
    const series = makeHealthySeries(30);
    for (const s of [12.0, 12.1, 12.3, 12.6, 12.8]) series.ess[stepAt(s)] = 4;
    const flags = detectBeliefCollapse(series, PARTICLES);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ kind: 'belief_collapsed', start: 12, end: 12.8 });
    expect(flags[0].evidence).toContain('5 steps');
    expect(flags[0].evidence).toContain('min 4.0 / 1000');
  });

  it('ignores isolated low-ESS steps, which a healthy filter has after sharp updates', () => {
    const series = makeHealthySeries(30);
    for (const s of [5, 10, 15, 20, 25]) series.ess[stepAt(s)] = 3;
    expect(detectBeliefCollapse(series, PARTICLES)).toEqual([]);
  });

  it('does not flag the first weighting of the initial belief', () => {
    const series = makeHealthySeries(10);
    series.ess[0] = 1;
    expect(detectBeliefCollapse(series, PARTICLES)).toEqual([]);
  });

  it('is critical only when long and below half the threshold', () => {
    const series = makeHealthySeries(30);
    const low = COLLAPSE_ESS_FRACTION * PARTICLES;
    for (let s = 10; s < 10.8; s += 0.1) series.ess[stepAt(s)] = 0.8 * low;
    expect(detectBeliefCollapse(series, PARTICLES)[0].severity).toBe('warning');
    for (let s = 10; s < 10.8; s += 0.1) series.ess[stepAt(s)] = 0.3 * low;
    expect(detectBeliefCollapse(series, PARTICLES)[0].severity).toBe('critical');
  });
});
