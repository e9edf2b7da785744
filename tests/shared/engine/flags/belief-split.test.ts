import { describe, expect, it } from 'vitest';
import { detectBeliefSplit } from '../../../../shared/engine/flags/belief-split';
import { forEachStep, makeHealthySeries, stepAt } from './synthetic-series';

describe('detectBeliefSplit', () => {
  it('flags several clusters held for a while, bridging a one-step merge', () => {
    const series = makeHealthySeries(40);
    forEachStep(10, 13, (k) => {
      series.clusters[k] = 2;
    });
    series.clusters[stepAt(11)] = 1;
    series.clusters[stepAt(12)] = 3;
    const flags = detectBeliefSplit(series);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ kind: 'belief_split', start: 10, severity: 'warning' });
    expect(flags[0].end).toBeCloseTo(12.9, 6);
    expect(flags[0].evidence).toContain('up to 3');
  });

  it('ignores a brief split and a single cluster', () => {
    const series = makeHealthySeries(40);
    expect(detectBeliefSplit(series)).toEqual([]);
    forEachStep(10, 10.5, (k) => {
      series.clusters[k] = 2;
    });
    expect(detectBeliefSplit(series)).toEqual([]);
  });

  it('is critical when the split lasts 5 s or more', () => {
    const series = makeHealthySeries(40);
    forEachStep(10, 16, (k) => {
      series.clusters[k] = 2;
    });
    expect(detectBeliefSplit(series)[0].severity).toBe('critical');
  });
});
