import { layoutFlagBand } from '@web/features/workspace/lib/flag-band-layout';
import { type Extent, stackRows } from '@web/features/workspace/lib/stack-rows';
import { describe, expect, it } from 'vitest';

// Known answers worked by hand; the row-count property is the interval-partitioning result
// (greedy by start uses as many rows as the deepest overlap; Kleinberg and Tardos, Algorithm
// Design, section 4.1).

/** The most extents covering one point, counted by brute force over every start. */
function deepestOverlap(extents: Extent[], gap: number): number {
  return Math.max(
    0,
    ...extents.map((e) => extents.filter((o) => o.start <= e.start && e.start < o.end + gap).length),
  );
}

describe('stackRows', () => {
  it('keeps extents apart from each other in one row', () => {
    expect(
      stackRows([
        { start: 0, end: 10 },
        { start: 20, end: 30 },
      ]),
    ).toEqual({ rows: [0, 0], rowCount: 1 });
  });

  it('puts three extents over one point in three rows', () => {
    const { rows, rowCount } = stackRows([
      { start: 0, end: 50 },
      { start: 10, end: 60 },
      { start: 20, end: 70 },
    ]);
    expect(rowCount).toBe(3);
    expect(new Set(rows).size).toBe(3);
  });

  it('reuses a row once it is free: a chain a–b–c with a and c apart needs two rows', () => {
    // Given out of order, so the answer cannot depend on the input order.
    expect(
      stackRows([
        { start: 40, end: 60 },
        { start: 0, end: 30 },
        { start: 20, end: 50 },
      ]),
    ).toEqual({ rows: [0, 0, 1], rowCount: 2 });
  });

  it('counts touching within the gap as overlapping', () => {
    expect(
      stackRows(
        [
          { start: 0, end: 10 },
          { start: 12, end: 20 },
        ],
        4,
      ).rowCount,
    ).toBe(2);
    expect(
      stackRows(
        [
          { start: 0, end: 10 },
          { start: 14, end: 20 },
        ],
        4,
      ).rowCount,
    ).toBe(1);
  });

  it('never overlaps two extents in a row and uses as many rows as the deepest overlap', () => {
    // A fixed pseudo-random set (a linear congruential sequence), so the check is repeatable.
    let seed = 12345;
    const next = () => {
      seed = (seed * 1103515245 + 12345) % 2 ** 31;
      return seed / 2 ** 31;
    };
    for (let trial = 0; trial < 50; trial++) {
      const extents = Array.from({ length: 30 }, () => {
        const start = next() * 1000;
        return { start, end: start + next() * 150 };
      });
      const { rows, rowCount } = stackRows(extents, 2);
      for (let i = 0; i < extents.length; i++)
        for (let j = i + 1; j < extents.length; j++)
          if (rows[i] === rows[j]) {
            const [a, b] =
              extents[i].start <= extents[j].start ? [extents[i], extents[j]] : [extents[j], extents[i]];
            expect(a.end + 2).toBeLessThanOrEqual(b.start);
          }
      expect(rowCount).toBe(deepestOverlap(extents, 2));
    }
  });
});

describe('layoutFlagBand', () => {
  it('gives a short bar with a long label its own room, so the next flag moves to another row', () => {
    // Bar 100–110 with a 120 px label needs 100–228; a bar at 150 falls inside it.
    const { placed, rowCount } = layoutFlagBand(
      [
        { x0: 100, x1: 110, labelWidth: 120 },
        { x0: 150, x1: 160, labelWidth: 20 },
      ],
      0,
      1000,
    );
    expect(rowCount).toBe(2);
    expect(placed.map((p) => p.row)).toEqual([0, 1]);
    expect(placed[0].labelX).toBe(104);
  });

  it('shifts a label left at the right edge so it is not cut off', () => {
    const { placed } = layoutFlagBand([{ x0: 950, x1: 990, labelWidth: 120 }], 0, 1000);
    expect(placed[0].labelX + 120).toBeLessThanOrEqual(1000);
    expect(placed[0].labelX).toBeGreaterThanOrEqual(0);
  });
});
