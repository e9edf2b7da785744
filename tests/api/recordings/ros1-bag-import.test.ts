import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readBundleSourceFiles } from '../../../api/src/bundles/read-bundle-files';
import { importRecording } from '../../../api/src/recordings/import-recording';
import { analyseReplay } from '../../../api/src/replays/analyse-replay';
import { replayFromFiles } from '../../../shared/engine';
import { writeRos1Bag } from '../../support/recordings/reference-writers';
import { importedBundle } from './imported-bundle';

/**
 * ROS 1 bags written by Debian's python3-rosbag (the ROS 1 reference implementation) from the
 * wheel-slip sample bundle; the importer must give back the values that were written.
 */
const SAMPLE = path.resolve('sample-logs/wheel-slip');
let dir: string;
beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), 'dc-ros1-'));
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const typed = importedBundle;

// The sample's filter in the ROS 1 flat parameter form (diff-corrected reads alphas as variances).
const PARAMS = `min_particles: 1000
max_particles: 1000
odom_model_type: diff-corrected
odom_alpha1: 0.05
odom_alpha2: 0.005
odom_alpha3: 0.01
odom_alpha4: 0.002
laser_model_type: likelihood_field
laser_z_hit: 0.9
laser_z_rand: 0.1
laser_sigma_hit: 0.12
laser_max_beams: 60
`;

describe.each(['bz2', 'lz4'] as const)('a ROS 1 bag with %s chunks', (compression) => {
  it('imports into a valid bundle holding the written values, and replays like the bundle written directly', async () => {
    const bag = await writeRos1Bag(SAMPLE, path.join(dir, `ws-${compression}.bag`), compression);
    const params = path.join(dir, 'amcl.yaml');
    writeFileSync(params, PARAMS);
    const out = path.join(dir, `ws-${compression}.zip`);
    const summary = await importRecording({ source: bag, params, out });
    expect(summary.format).toBe('ros1-bag');
    expect(summary.topics).toMatchObject({ tf: '/tf', tf_static: '/tf_static', scans: '/scan', map: '/map' });

    const imported = await typed({ kind: 'zip', path: out });
    const written = await typed({ kind: 'folder', path: SAMPLE });
    // Odometry: float64 in the bag, so equal to the written decimals; yaw back from the quaternion.
    expect(imported.odometry.t.length).toBe(written.odometry.t.length);
    for (const i of [0, 123, written.odometry.t.length - 1]) {
      expect(imported.odometry.x[i]).toBeCloseTo(written.odometry.x[i], 9);
      expect(imported.odometry.theta[i]).toBeCloseTo(written.odometry.theta[i], 9);
      // rospy.Time keeps nanoseconds: t within 1 us of the written t.
      expect(Math.abs(imported.odometry.t[i] - written.odometry.t[i])).toBeLessThan(1e-6);
    }
    // LaserScan ranges are float32 (sensor_msgs/LaserScan definition): equal to 7 significant digits.
    const scans = imported.scans;
    if (!scans || !written.scans) throw new Error('no scans');
    expect(scans.count).toBe(written.scans.count);
    for (const k of [0, 100, 5000, scans.ranges.length - 1]) {
      const expected = written.scans.ranges[k];
      if (Number.isNaN(expected)) expect(Number.isNaN(scans.ranges[k])).toBe(true);
      else expect(scans.ranges[k]).toBeCloseTo(expected, 5);
    }
    // Mount from the static base_link -> laser transform the writer put on /tf_static.
    expect(imported.manifest.scan?.mount[0]).toBeCloseTo(0.2, 9);
    expect(imported.manifest.scan?.beams).toBe(written.manifest.scan?.beams);
    // OccupancyGrid runs south to north (nav_msgs/OccupancyGrid); map.json north first: same cells.
    expect(Array.from(imported.map.grid?.cells ?? [])).toEqual(Array.from(written.map.grid?.cells ?? []));
    // Covariance indices 0, 1, 7, 35 of the row-major 6x6 (geometry_msgs/PoseWithCovariance).
    expect(imported.onboard?.cov?.xx[5]).toBeCloseTo(written.onboard?.cov?.xx[5] ?? -1, 12);
    expect(imported.onboard?.cov?.tt[5]).toBeCloseTo(written.onboard?.cov?.tt[5] ?? -1, 12);
    expect(imported.commands?.v[10]).toBeCloseTo(written.commands?.v[10] ?? -1, 12);
    expect(imported.manifest.filter.motion.alpha).toEqual([0.05, 0.005, 0.01, 0.002]);
    expect(imported.manifest.provenance?.sources.map((s) => s.role)).toEqual(['recording', 'params']);
    expect(imported.manifest.provenance?.assumed.some((line) => line.startsWith('robot.footprint'))).toBe(
      true,
    );

    // Replays with the same what-if settings: same RMSE against the onboard estimate within
    // 0.01 m, and the wheel slip (18 s to 22 s, sample-logs/catalog.json) flagged in both.
    const overrides = { seed: 211, resampling_method: 'systematic', resampling_threshold: 0.5 };
    const replayOf = async (source: { kind: 'zip' | 'folder'; path: string }) => {
      const read = await readBundleSourceFiles(source);
      if (!read.ok) throw new Error('unreadable');
      const result = replayFromFiles(read.files, overrides);
      return { metrics: result.metrics, flags: analyseReplay(result.bundle, result, result.context).flags };
    };
    const direct = await replayOf({ kind: 'folder', path: SAMPLE });
    const fromBag = await replayOf({ kind: 'zip', path: out });
    expect(
      Math.abs((fromBag.metrics.rmse_onboard ?? 99) - (direct.metrics.rmse_onboard ?? -99)),
    ).toBeLessThan(0.01);
    const slipFlag = (flags: { kind: string; start: number; end: number }[]) =>
      flags.some((f) => f.kind === 'odometry_disagrees_with_scans' && f.start <= 21 && f.end >= 18);
    expect(slipFlag(direct.flags)).toBe(true);
    expect(slipFlag(fromBag.flags)).toBe(true);
  }, 240_000);
});

describe('a ROS 1 bag whose scans are stamped in the moving base frame', () => {
  // A scanner at the robot's origin often publishes in base_link itself: /tf then carries
  // odom -> base_link and there is no static mount. base_link is the base frame (REP 105), not a
  // laser mounted on odom.
  it('reads the odometry from /tf and mounts the scanner at the origin', async () => {
    const bag = await writeRos1Bag(SAMPLE, path.join(dir, 'base-frame.bag'), 'lz4', 200, {
      scanFrame: 'base_link',
    });
    const params = path.join(dir, 'amcl-base.yaml');
    writeFileSync(params, PARAMS);
    const out = path.join(dir, 'base-frame.zip');
    const summary = await importRecording({ source: bag, params, out });
    expect(summary.topics).toMatchObject({ tf: '/tf', scans: '/scan' });
    const imported = await typed({ kind: 'zip', path: out });
    const written = await typed({ kind: 'folder', path: SAMPLE });
    expect(imported.manifest.scan?.mount).toEqual([0, 0, 0]);
    expect(imported.odometry.x[50]).toBeCloseTo(written.odometry.x[50], 9);
  }, 240_000);
});
