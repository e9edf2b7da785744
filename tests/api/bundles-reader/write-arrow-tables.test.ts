import { readFile } from 'node:fs/promises';
import { tableFromIPC } from 'apache-arrow';
import { describe, expect, it } from 'vitest';
import { writeArrowTables } from '../../../api/src/bundles/write-arrow-tables';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import { makeBundleFiles, makeTempDir } from '../../support/bundle-fixtures';

describe('writeArrowTables', () => {
  it('writes one IPC stream per table that apache-arrow reads back with the same rows and values', async () => {
    const result = validateBundleFiles(makeBundleFiles({ steps: 33, beams: 6 }));
    if (!result.ok) throw new Error('fixture should be valid');
    const { bundle } = result;
    const written = await writeArrowTables(bundle, await makeTempDir());
    expect(written.map((table) => table.name)).toEqual([
      'odometry',
      'scans',
      'detections',
      'onboard_pose',
      'events',
      'commands',
      'reference_pose',
    ]);
    const read = async (name: string) =>
      tableFromIPC(await readFile(written.find((table) => table.name === name)!.file));

    const odometry = await read('odometry');
    expect(odometry.numRows).toBe(33);
    expect(odometry.getChild('theta')?.toArray()).toEqual(bundle.odometry.theta);

    const scans = await read('scans');
    expect(scans.numRows).toBe(33);
    const ranges = scans.getChild('ranges')!;
    for (let k = 0; k < 33; k++) {
      const expected = Array.from(bundle.scans!.ranges.subarray(k * 6, (k + 1) * 6), (value) =>
        Number.isNaN(value) ? null : value,
      );
      expect(Array.from(ranges.get(k)!)).toEqual(expected);
    }

    const detections = await read('detections');
    expect(detections.toArray().map((row) => row.class)).toEqual(['reflector', 'dock', 'column']);
    const events = await read('events');
    expect(events.getChild('detail')?.get(0)).toBe('person entered slow-down zone, aisle 3');
    expect((await read('onboard_pose')).schema.fields.map((field) => field.name)).toContain('cov_tt');
    expect(written.find((table) => table.name === 'reference_pose')?.rows).toBe(33);
  });
});
