import { describe, expect, it } from 'vitest';
import {
  detectMapOutOfDate,
  type FreeSpaceEndpointCounts,
} from '../../../../shared/engine/flags/map-out-of-date';
import { forEachStep, makeHealthySeries, stepAt } from './synthetic-series';

/** Per-step counts of a scan that fits the map: 55 endpoints, 52 near obstacles, none on free space. */
function fittingCounts(steps: number): FreeSpaceEndpointCounts {
  return {
    free: new Int32Array(steps),
    fitting: new Int32Array(steps).fill(52),
    total: new Int32Array(steps).fill(55),
    sumX: new Float64Array(steps),
    sumY: new Float64Array(steps),
  };
}

/** An obstacle the map lacks at (17, 8) m: `free` of the 55 endpoints land on it, the rest still fit. */
function addObstacle(counts: FreeSpaceEndpointCounts, from: number, to: number, free: number): void {
  forEachStep(from, to, (k) => {
    counts.free[k] = free;
    counts.fitting[k] = 55 - free - 2;
    counts.sumX[k] = 17 * free;
    counts.sumY[k] = 8 * free;
  });
}

describe('detectMapOutOfDate', () => {
  it('flags endpoints that keep landing on free space while the rest of the scan fits', () => {
    const series = makeHealthySeries(60);
    const counts = fittingCounts(series.t.length);
    addObstacle(counts, 20, 32, 15);
    const flags = detectMapOutOfDate(series, counts);
    expect(flags).toHaveLength(1);
    expect(flags[0].kind).toBe('map_out_of_date');
    // The trailing 1 s share needs a few steps to pass 8 %: 15 / (4 x 55) = 6.8 %, 15 x 2 / (5 x 55) = 11 %.
    expect(flags[0].start).toBeGreaterThanOrEqual(20);
    expect(flags[0].start).toBeLessThanOrEqual(20.3);
    expect(flags[0].end).toBeCloseTo(31.9, 6);
    // 15 of 55 = 27 % for 11.9 s: above the 20 % / 3 s critical rule.
    expect(flags[0].severity).toBe('critical');
    expect(flags[0].evidence).toContain('centred near (17.0, 8.0) m');
  });

  it('ignores a share below the threshold and isolated stray returns', () => {
    const series = makeHealthySeries(60);
    const counts = fittingCounts(series.t.length);
    addObstacle(counts, 20, 32, 2);
    for (const s of [5, 10, 15]) counts.free[stepAt(s)] = 30;
    expect(detectMapOutOfDate(series, counts)).toEqual([]);
  });

  it('does not blame the map when most of the scan misfits (a wrong pose)', () => {
    const series = makeHealthySeries(60);
    const counts = fittingCounts(series.t.length);
    addObstacle(counts, 20, 32, 15);
    forEachStep(20, 32, (k) => {
      counts.fitting[k] = 20;
    });
    expect(detectMapOutOfDate(series, counts)).toEqual([]);
  });

  it('does not blame the map where the reference shows the replay is off', () => {
    const series = makeHealthySeries(60);
    const counts = fittingCounts(series.t.length);
    addObstacle(counts, 20, 32, 15);
    forEachStep(20, 32, (k) => {
      series.error_reference[k] = 0.7;
    });
    expect(detectMapOutOfDate(series, counts)).toEqual([]);
  });
});
