import { extent } from 'd3';
import { describe, expect, it } from 'vitest';
import { needsReduction, reduceMinMax } from '../../../../web/src/features/workspace/lib/level-of-detail';

/** A deterministic wiggly series with single-step spikes and gaps. */
function series(n: number): (number | null)[] {
  return Array.from({ length: n }, (_, k) => {
    if (k % 997 === 0) return null;
    if (k % 613 === 0) return 50;
    if (k % 389 === 0) return -40;
    return Math.sin(k / 37) * 10 + ((k * 7919) % 13) / 13;
  });
}

describe('min/max level-of-detail reduction', () => {
  it('keeps, per pixel column, exactly the extremes d3.extent finds over that column', () => {
    // Reference: d3-array extent over each column's slice (d3 7, npm).
    const values = series(6000);
    const columns = reduceMinMax(values, 0, values.length, 800);
    expect(columns.length).toBeGreaterThan(700);
    expect(columns.length).toBeLessThanOrEqual(800);
    for (let c = 0; c < columns.length; c++) {
      const end = c + 1 < columns.length ? columns[c + 1].index : values.length;
      const [min, max] = extent(values.slice(columns[c].index, end).filter((v): v is number => v !== null));
      expect(columns[c].min).toBe(min);
      expect(columns[c].max).toBe(max);
    }
  });

  it('never loses a spike or a dip (the global extremes survive)', () => {
    const values = series(12000);
    const columns = reduceMinMax(values, 0, values.length, 300);
    const [globalMin, globalMax] = extent(values.filter((v): v is number => v !== null));
    expect(Math.min(...columns.map((c) => c.min))).toBe(globalMin);
    expect(Math.max(...columns.map((c) => c.max))).toBe(globalMax);
  });

  it('covers every step of the window exactly once, in order', () => {
    const values = Array.from({ length: 1234 }, (_, k) => k);
    const columns = reduceMinMax(values, 100, 1100, 333);
    expect(columns[0].index).toBe(100);
    for (let c = 1; c < columns.length; c++) {
      expect(columns[c].index).toBe(columns[c - 1].max + 1);
    }
    expect(columns.at(-1)!.max).toBe(1099);
  });

  it('leaves a column of only missing values out, so a gap stays a gap', () => {
    const values = [1, 2, null, null, 5, 6];
    const columns = reduceMinMax(values, 0, 6, 3);
    expect(columns.map((c) => c.index)).toEqual([0, 4]);
  });

  it('is the identity when there are fewer steps than pixels', () => {
    const values = [3, 1, 4, 1, 5];
    const columns = reduceMinMax(values, 0, 5, 100);
    expect(columns.map((c) => [c.min, c.max])).toEqual(values.map((v) => [v, v]));
    expect(needsReduction(5, 100)).toBe(false);
    expect(needsReduction(6000, 900)).toBe(true);
  });
});
