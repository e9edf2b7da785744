/**
 * Counterfactual bundles: a counterfactual is an ordinary replay of an edited copy of the bundle.
 * Checked by properties of that definition (no expected value comes from the code under test):
 * with a window over the whole log and no edits it is the original replay, bit for bit; edits
 * touch only what they name and never the original bundle.
 */
import { describe, expect, it } from 'vitest';
import { CELL_OCCUPIED } from '../../../../shared/bundle/types';
import { readBundleFiles, replayBundle } from '../../../../shared/engine';
import type { CounterfactualSettings } from '../../../../shared/engine/causes/cause-types';
import {
  buildCounterfactualBundle,
  replayCounterfactual,
} from '../../../../shared/engine/causes/counterfactual-bundle';
import { readSampleFiles } from '../../../samples/golden-cases';

const bundle = readBundleFiles(readSampleFiles('healthy-shift'));
const original = replayBundle(bundle, {}, { keyframeInterval: 0 });
const lastT = bundle.odometry.t[bundle.odometry.t.length - 1];

describe('buildCounterfactualBundle', () => {
  it('with the whole log as its span and no edits, replays to the original digest', () => {
    const settings: CounterfactualSettings = {
      span: { start: bundle.odometry.t[0], end: lastT },
      replay: original.settings,
    };
    expect(replayCounterfactual(bundle, settings).digest).toBe(original.digest);
  });

  it('cuts every table to the span', () => {
    const cut = buildCounterfactualBundle(bundle, {
      span: { start: 10, end: 20 },
      replay: original.settings,
    });
    for (const table of [cut.odometry, cut.scans!, cut.reference!]) {
      expect(table.t.length).toBeGreaterThan(0);
      expect(table.t[0]).toBeGreaterThanOrEqual(10);
      expect(table.t[table.t.length - 1]).toBeLessThanOrEqual(20);
    }
    expect(cut.odometry.x.length).toBe(cut.odometry.t.length);
    expect(cut.scans!.ranges.length).toBe(cut.scans!.count * cut.scans!.beams);
  });

  it('masks the named beams and short returns only inside the mask interval, and marks the named cells occupied', () => {
    const free = bundle.map.grid!.cells.findIndex((cell) => cell !== CELL_OCCUPIED);
    const before = bundle.scans!.ranges.slice();
    const cut = buildCounterfactualBundle(bundle, {
      span: { start: 10, end: 20 },
      replay: original.settings,
      masked_beams: [135],
      masked_below: 2,
      mask: { start: 12, end: 14 },
      occupied_cells: [free],
    });
    const scans = cut.scans!;
    for (let row = 0; row < scans.count; row++) {
      const inside = scans.t[row] >= 12 && scans.t[row] <= 14;
      const beam = scans.ranges[row * scans.beams + 135];
      if (inside) expect(Number.isNaN(beam)).toBe(true);
      for (let b = 0; b < scans.beams; b++) {
        const range = scans.ranges[row * scans.beams + b];
        if (inside) expect(range < 2).toBe(false);
      }
    }
    const firstRow = Array.from(bundle.scans!.t).findIndex((t) => t >= 10);
    for (let row = 0; row < scans.count; row++) {
      if (scans.t[row] <= 14 && scans.t[row] >= 12) continue;
      const kept = scans.ranges.subarray(row * scans.beams, (row + 1) * scans.beams);
      const source = before.subarray((firstRow + row) * scans.beams, (firstRow + row + 1) * scans.beams);
      expect(kept).toEqual(source);
    }
    expect(cut.map.grid!.cells[free]).toBe(CELL_OCCUPIED);
    // The original bundle is untouched.
    expect(bundle.map.grid!.cells[free]).not.toBe(CELL_OCCUPIED);
    expect(bundle.scans!.ranges).toEqual(before);
  });
});
