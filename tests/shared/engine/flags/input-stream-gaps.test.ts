import { describe, expect, it } from 'vitest';
import type { PoseColumns } from '../../../../shared/bundle/types';
import { detectInputStreamProblems } from '../../../../shared/engine/flags/input-stream-gaps';
import { makeSyntheticBundle } from '../../../support/engine-fixtures';

/** Removes rows [from, to) of a pose table. */
function dropRows(table: PoseColumns, from: number, to: number): PoseColumns {
  const cut = (column: Float64Array) => Float64Array.from([...column.slice(0, from), ...column.slice(to)]);
  return { t: cut(table.t), x: cut(table.x), y: cut(table.y), theta: cut(table.theta) };
}

describe('detectInputStreamProblems', () => {
  it('finds nothing in a clean 10 Hz recording', () => {
    expect(detectInputStreamProblems(makeSyntheticBundle({ seconds: 20, particles: 100 }))).toEqual([]);
  });

  it('flags an odometry gap longer than 1 s as critical and a scan gap as a warning', () => {
    const bundle = makeSyntheticBundle({ seconds: 20, particles: 100 });
    bundle.odometry = dropRows(bundle.odometry, 51, 66);
    bundle.scans = {
      ...bundle.scans!,
      t: Float64Array.from([...bundle.scans!.t].filter((t) => t < 12 || t > 12.5)),
    };
    const flags = detectInputStreamProblems(bundle);
    const gaps = flags.filter((flag) => flag.kind === 'input_gap');
    expect(gaps).toHaveLength(2);
    expect(gaps[0]).toMatchObject({ start: 5, severity: 'critical' });
    expect(gaps[0].end).toBeCloseTo(6.6, 6);
    expect(gaps[0].evidence).toContain('No odometry rows for 1.60 s');
    expect(gaps[1]).toMatchObject({ start: 11.9, severity: 'warning' });
  });

  it('flags odometry that moved further than the top speed allows', () => {
    const bundle = makeSyntheticBundle({ seconds: 20, particles: 100 });
    // max_speed 1.5 m/s: 0.1 s allows 0.275 m with the 1.5 factor and 0.05 m slack; jump 1 m.
    for (let k = 100; k < bundle.odometry.t.length; k++) bundle.odometry.x[k] += 1;
    const jumps = detectInputStreamProblems(bundle).filter((flag) => flag.kind === 'odometry_jump');
    expect(jumps).toHaveLength(1);
    expect(jumps[0]).toMatchObject({ start: 9.9, end: 10, severity: 'critical' });
  });
});
