import type { TReplay } from '@shared/contracts/replays';
import {
  flagCountRows,
  formatDivergence,
  formatMetres,
  pickOriginalReplay,
} from '@web/features/fixes/lib/compare-replays';
import { parseOverrides } from '@web/features/fixes/lib/parse-overrides';
import { rollup } from 'd3';
import { describe, expect, it } from 'vitest';

const replay = (patch: Partial<TReplay>): TReplay => ({
  id: 'r',
  bundleId: 'b1',
  caseId: 'c',
  label: '',
  status: 'done',
  overrides: {},
  settings: null,
  digest: 'd',
  engine: null,
  steps: 1,
  elapsedMs: 1,
  metrics: null,
  flags: [],
  error: null,
  progress: null,
  createdBy: { id: 'u', name: 'U' },
  createdAt: '2026-03-14T09:00:00Z',
  finishedAt: null,
  ...patch,
});

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

  it('compares against the earliest finished replay of the same bundle that ran without overrides', () => {
    const verification = replay({
      id: 'v',
      overrides: { particles: 800 },
      createdAt: '2026-03-14T12:00:00Z',
    });
    const tuned = replay({ id: 't', overrides: { particles: 300 }, createdAt: '2026-03-14T08:00:00Z' });
    const plain = replay({ id: 'p', createdAt: '2026-03-14T10:00:00Z' });
    const otherBundle = replay({ id: 'o', bundleId: 'b2', createdAt: '2026-03-14T07:00:00Z' });
    const failed = replay({ id: 'f', status: 'failed', createdAt: '2026-03-14T06:00:00Z' });
    expect(pickOriginalReplay([verification, tuned, plain, otherBundle, failed], verification)?.id).toBe('p');
    expect(pickOriginalReplay([verification, tuned], verification)?.id).toBe('t');
    expect(pickOriginalReplay([verification], verification)).toBeUndefined();
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
