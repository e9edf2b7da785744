import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inspectBundle } from '../../../api/src/bundles/inspect-bundle';
import { importRecording } from '../../../api/src/recordings/import-recording';
import { writeRosbag2Db3, writeRosbag2Folder } from '../../support/recordings/write-rosbag2-sqlite';

/**
 * rosbag2 sqlite3 recordings in the Humble layout (no stored definitions): CDR written by hand
 * with @foxglove/cdr (tests/support/recordings/write-mcap.ts); expected values are the sample's.
 */
const SAMPLE = path.resolve('sample-logs/wheel-slip');
let dir: string;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'dc-db3-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function importAndRead(source: string, out: string) {
  const summary = await importRecording({ source, out, from: '1.0', to: '8.0' });
  const inspection = await inspectBundle({ kind: 'zip', path: out });
  expect(inspection.issues.filter((issue) => issue.severity !== 'warning')).toEqual([]);
  if (!inspection.bundle) throw new Error('no bundle');
  return { summary, bundle: inspection.bundle };
}

describe('rosbag2 sqlite3', () => {
  it('reads a bare .db3 with built-in definitions, cut to --from/--to', async () => {
    const source = await writeRosbag2Db3(SAMPLE, path.join(dir, 'incident.db3'), 100);
    const { summary, bundle } = await importAndRead(source, path.join(dir, 'db3.zip'));
    expect(summary.format).toBe('rosbag2-sqlite3');
    // Window 1.0 s to 8.0 s of the sample (odometry every 0.1 s): t restarts at the cut.
    expect(bundle.manifest.start_time).toBe('2026-11-16T13:47:31Z');
    expect(bundle.odometry.t[0]).toBeCloseTo(0, 9);
    expect(bundle.odometry.t.length).toBe(71);
    // The filter starts from the robot's own estimate at the cut: onboard_pose.csv row t = 1.00.
    expect(bundle.manifest.filter.initial).toMatchObject({
      mode: 'pose',
      sigma_xy: expect.closeTo(0.025, 9),
    });
    expect(bundle.manifest.provenance?.topics.scans).toBe('/scan');
  }, 120_000);

  it('reads a rosbag2 folder through its metadata.yaml', async () => {
    const folder = await writeRosbag2Folder(SAMPLE, path.join(dir, 'bag_folder'), 100);
    const { summary, bundle } = await importAndRead(folder, path.join(dir, 'folder.zip'));
    expect(summary.sources.map((source) => source.name)).toEqual([
      'bag_folder/incident_0.db3',
      'bag_folder/metadata.yaml',
    ]);
    expect(summary.sources[0]).toMatchObject({ role: 'recording', format: 'rosbag2-sqlite3' });
    expect(bundle.scans?.count).toBe(71);
  }, 120_000);
});
