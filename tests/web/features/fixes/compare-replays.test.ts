import { flagCountRows, formatDivergence, formatMetres } from '@web/features/fixes/lib/compare-replays';
import { parseOverrides } from '@web/features/fixes/lib/parse-overrides';
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

describe('verification replay overrides box', () => {
  it('empty means the manifest settings; JSON the engine accepts passes through', () => {
    expect(parseOverrides('  ')).toEqual({ overrides: {} });
    expect(parseOverrides('{"particles": 800, "recovery": true}')).toEqual({
      overrides: { particles: 800, recovery: true },
    });
  });

  it('names the problem: not JSON, or the field the engine refuses', () => {
    expect(parseOverrides('{particles: 800')).toEqual({ problem: expect.stringMatching(/must be JSON/) });
    expect(parseOverrides('{"particles": 0}').problem).toMatch(/field "particles"/);
    expect(parseOverrides('{"particels": 10}').problem).toMatch(/particels|Unrecognized/i);
  });
});
