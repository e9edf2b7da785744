import { execFile, execFileSync } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);
const SCRIPT = path.resolve('tests/support/recordings/write-ros1-bag.py');
const DEBIAN_PACKAGES = [
  'python3-rosbag',
  'python3-sensor-msgs',
  'python3-nav-msgs',
  'python3-tf2-msgs',
  'python3-geometry-msgs',
];

/** Installs Debian's ROS 1 python packages when missing (as root, like the chromium set-up). */
export function ensureRosbagPython(): void {
  try {
    execFileSync('/usr/bin/python3', ['-c', 'import rosbag, sensor_msgs.msg, nav_msgs.msg, tf2_msgs.msg'], {
      stdio: 'ignore',
    });
  } catch {
    execFileSync('apt-get', ['install', '-y', '-qq', ...DEBIAN_PACKAGES], {
      stdio: 'ignore',
      env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
    });
  }
}

/** Writes a bundle folder as a ROS 1 bag with python3-rosbag (the ROS 1 reference writer). */
export async function writeRos1Bag(
  bundleFolder: string,
  out: string,
  compression: 'none' | 'bz2' | 'lz4',
  scanLimit?: number,
  { scanFrame = 'laser' }: { scanFrame?: 'laser' | 'base_link' } = {},
): Promise<string> {
  ensureRosbagPython();
  const args = [SCRIPT, bundleFolder, out, compression, ...(scanLimit ? [String(scanLimit)] : [])];
  await run('/usr/bin/python3', args, { timeout: 120_000, env: { ...process.env, SCAN_FRAME: scanFrame } });
  return out;
}
