import type { TProbableCause } from '@shared/contracts/replays';
import {
  describeCauses,
  flagCountRows,
  formatDivergence,
  formatMetres,
} from '@web/features/fixes/lib/compare-replays';
import { rollup } from 'd3';
import { describe, expect, it } from 'vitest';

describe('side-by-side replay comparison', () => {
  it('counts flags per kind as d3.rollup does, with zero where one replay has none', () => {
    const original = ['belief_collapse', 'map_mismatch', 'belief_collapse', 'input_gap'].map((kind) => ({
      kind,
    }));
    const verification = [{ kind: 'input_gap' }, { kind: 'input_gap' }];
    const rows = flagCountRows(original, verification);
    // Reference: d3-array rollup(data, v => v.length, key), the npm d3 package.
    const before = rollup(
      original,
      (v) => v.length,
      (d) => d.kind,
    );
    const after = rollup(
      verification,
      (v) => v.length,
      (d) => d.kind,
    );
    for (const row of rows) {
      expect(row.original).toBe(before.get(row.kind) ?? 0);
      expect(row.verification).toBe(after.get(row.kind) ?? 0);
    }
    expect(rows.map((r) => r.kind)).toEqual(['belief_collapse', 'input_gap', 'map_mismatch']);
  });

  it('writes units after numbers and a dash or "never" for missing values (common practice)', () => {
    expect(formatMetres(0.0414735)).toBe('0.041 m');
    expect(formatMetres(null)).toBe('—');
    expect(formatMetres(Number.NaN)).toBe('—');
    expect(formatDivergence(12.44)).toBe('12.4 s');
    expect(formatDivergence(null)).toBe('never');
  });
});

describe('probable causes in the comparison', () => {
  const cause = (kind: TProbableCause['kind'], confidence: number): TProbableCause => ({
    kind,
    start: 1,
    end: 2,
    confidence,
    evidence: '',
    against: '',
    counterfactuals: [],
  });

  // Labels are the product's own words (shared/human-labels.ts); percentages rounded (common practice).
  it('lists found causes in the API order with their confidence, and says when none was found', () => {
    expect(describeCauses([cause('map_changed', 0.724), cause('odometry_fault', 0.31)])).toBe(
      'Site differs from the map 72 % · Odometry fault 31 %',
    );
    expect(describeCauses([cause('none', 0.9)])).toBe('none found');
    expect(describeCauses([])).toBe('none found');
    expect(describeCauses(undefined)).toBe('…');
  });
});
