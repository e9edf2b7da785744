import path from 'node:path';
import type { ScanConfig } from '../../../shared/bundle/types';
import { quaternionYaw } from '../../../shared/recording/quaternion-yaw';
import type { Discovery } from './discover-recording';
import { LineWriter } from './line-writer';
import { RecordingError } from './recording-error';
import type { RecordingReader } from './recording-reader';
import {
  frameName,
  type LaserScanMessage,
  type OdometryMessage,
  type PoseWithCovarianceStampedMessage,
  stampNs,
  type TfMessage,
  type TwistMessage,
  type TwistStampedMessage,
} from './ros-message-shapes';

export interface TableWriteOptions {
  folder: string;
  /** Bundle time zero (ns since the epoch); earlier stamps are left out. */
  zeroNs: bigint;
  fromNs?: bigint;
  toNs?: bigint;
  gate?: { distance: number; angle: number };
}

export interface TableWriteResult {
  rows: Record<string, number>;
  scan?: ScanConfig;
  /** Why ranges became null (REP 117 meanings). */
  nullRanges: { noReturn: number; invalid: number; aboveMax: number; belowMin: number };
  scansGated: number;
  dropped: Record<string, number>;
  /** Largest |log time - header stamp| per topic, s. */
  clockGap: Record<string, number>;
  firstNs?: bigint;
  lastNs?: bigint;
}

/** Seconds since zero with nanosecond resolution and no float noise from the epoch's size. */
const secondsSince = (ns: bigint, zeroNs: bigint) => Number(ns - zeroNs) / 1e9;
/** A float32 written as the short decimal it came from (2.41, not 2.4100000858306885). */
const float32Text = (value: number) => String(Number(value.toPrecision(7)));

/**
 * The second read: streams the window's messages into the bundle's tables, one line at a time.
 * Header stamps give `t`; the recorder's log time only selects the window and checks the clocks.
 */
export async function writeRecordingTables(
  reader: RecordingReader,
  discovery: Discovery,
  options: TableWriteOptions,
  onProgress: (fraction: number) => void = () => {},
): Promise<TableWriteResult> {
  const { roles } = discovery;
  const { zeroNs } = options;
  const odometry = new LineWriter(path.join(options.folder, 'odometry.csv'), 't,x,y,theta');
  const scans = roles.scans ? new LineWriter(path.join(options.folder, 'scans.ndjson')) : undefined;
  const poses = roles.onboard_pose
    ? new LineWriter(path.join(options.folder, 'onboard_pose.csv'), 't,x,y,theta,cov_xx,cov_xy,cov_yy,cov_tt')
    : undefined;
  const commands = roles.commands
    ? new LineWriter(path.join(options.folder, 'commands.csv'), 't,v,omega')
    : undefined;
  const result: TableWriteResult = {
    rows: {},
    nullRanges: { noReturn: 0, invalid: 0, aboveMax: 0, belowMin: 0 },
    scansGated: 0,
    dropped: {},
    clockGap: {},
  };
  const lastT: Record<string, number> = {};
  const drop = (table: string) => {
    result.dropped[table] = (result.dropped[table] ?? 0) + 1;
  };
  /** Keeps a table's t strictly increasing and at or after zero; anything else is counted. */
  const accept = (table: string, t: number) => {
    if (t < 0 || (lastT[table] !== undefined && t <= lastT[table])) {
      drop(table);
      return false;
    }
    lastT[table] = t;
    return true;
  };
  const noteClock = (topic: string, logNs: bigint, stamp: bigint) => {
    const gap = Math.abs(Number(logNs - stamp)) / 1e9;
    if (gap > (result.clockGap[topic] ?? 0)) result.clockGap[topic] = gap;
  };
  let latestOdom: [number, number, number] | undefined;
  let lastUsedOdom: [number, number, number] | undefined;
  let firstScan: LaserScanMessage | undefined;
  const span = Number((options.toNs ?? discovery.endNs) - (options.fromNs ?? discovery.startNs)) || 1;

  const writeOdometry = async (stamp: bigint, x: number, y: number, theta: number) => {
    const t = secondsSince(stamp, zeroNs);
    if (!accept('odometry.csv', t)) return;
    latestOdom = [x, y, theta];
    await odometry.write(`${t},${x},${y},${theta}`);
  };

  const wanted = Object.values(roles).filter((topic) => topic !== roles.tf_static && topic !== roles.map);
  for await (const message of reader.messages({
    topics: wanted,
    startNs: options.fromNs,
    endNs: options.toNs,
  })) {
    const { topic, data, logTimeNs } = message;
    result.firstNs ??= logTimeNs;
    result.lastNs = logTimeNs;
    onProgress(Number(logTimeNs - (options.fromNs ?? discovery.startNs)) / span);
    const where = { file: reader.file, topic, timeNs: logTimeNs };
    let decoded: unknown;
    try {
      decoded = reader.topics.get(topic)?.decode(data);
    } catch (error) {
      if (error instanceof RecordingError) throw error;
      throw new RecordingError(`message cannot be decoded (${(error as Error).message})`, where);
    }
    if (topic === roles.tf && discovery.odometrySource === 'tf') {
      for (const transform of (decoded as TfMessage).transforms) {
        if (frameName(transform.child_frame_id) !== discovery.baseFrame) continue;
        if (frameName(transform.header.frame_id) !== discovery.odomFrame) continue;
        const stamp = stampNs(transform.header.stamp);
        noteClock(topic, logTimeNs, stamp);
        const { translation, rotation } = transform.transform;
        await writeOdometry(stamp, translation.x, translation.y, quaternionYaw(rotation));
      }
    } else if (topic === roles.odometry && discovery.odometrySource === 'odometry') {
      const odom = decoded as OdometryMessage;
      const stamp = stampNs(odom.header.stamp);
      noteClock(topic, logTimeNs, stamp);
      const { position, orientation } = odom.pose.pose;
      await writeOdometry(stamp, position.x, position.y, quaternionYaw(orientation));
    } else if (topic === roles.scans && scans) {
      const scan = decoded as LaserScanMessage;
      const stamp = stampNs(scan.header.stamp);
      noteClock(topic, logTimeNs, stamp);
      if (!firstScan) firstScan = scan;
      else checkSameScanGeometry(firstScan, scan, { ...where, timeNs: stamp });
      if (options.gate && lastUsedOdom && latestOdom) {
        const [dx, dy, dtheta] = [0, 1, 2].map(
          (i) => (latestOdom as number[])[i] - (lastUsedOdom as number[])[i],
        );
        const turned = Math.abs(Math.atan2(Math.sin(dtheta), Math.cos(dtheta)));
        if (
          Math.abs(dx) <= options.gate.distance &&
          Math.abs(dy) <= options.gate.distance &&
          turned <= options.gate.angle
        ) {
          result.scansGated++;
          continue;
        }
      }
      const t = secondsSince(stamp, zeroNs);
      if (!accept('scans.ndjson', t)) continue;
      if (latestOdom) lastUsedOdom = latestOdom;
      await scans.write(
        JSON.stringify({ t, ranges: Array.from(scan.ranges, (r) => mapRange(r, scan, result)) }),
      );
    } else if (topic === roles.onboard_pose && poses) {
      const pose = decoded as PoseWithCovarianceStampedMessage;
      const stamp = stampNs(pose.header.stamp);
      noteClock(topic, logTimeNs, stamp);
      const t = secondsSince(stamp, zeroNs);
      if (!accept('onboard_pose.csv', t)) continue;
      const { position, orientation } = pose.pose.pose;
      const c = pose.pose.covariance;
      await poses.write(
        `${t},${position.x},${position.y},${quaternionYaw(orientation)},${c[0]},${c[1]},${c[7]},${c[35]}`,
      );
    } else if (topic === roles.commands && commands) {
      // A bare Twist has no header: its recording time is the only time it has.
      const stamped = (decoded as TwistStampedMessage).header ? (decoded as TwistStampedMessage) : undefined;
      const twist = stamped ? stamped.twist : (decoded as TwistMessage);
      const stamp = stamped ? stampNs(stamped.header.stamp) : logTimeNs;
      const t = secondsSince(stamp, zeroNs);
      if (!accept('commands.csv', t)) continue;
      await commands.write(`${t},${twist.linear.x},${twist.angular.z}`);
    }
  }
  for (const [name, writer] of [
    ['odometry.csv', odometry],
    ['scans.ndjson', scans],
    ['onboard_pose.csv', poses],
    ['commands.csv', commands],
  ] as const) {
    if (!writer) continue;
    await writer.close();
    result.rows[name] = writer.lines;
  }
  if (firstScan) {
    const mount = discovery.mount ?? [0, 0, 0];
    result.scan = {
      mount: [mount[0], mount[1], mount[2]],
      angle_min: Number(firstScan.angle_min.toPrecision(7)),
      angle_increment: Number(firstScan.angle_increment.toPrecision(7)),
      beams: firstScan.ranges.length,
      range_min: Number(firstScan.range_min.toPrecision(7)),
      range_max: Number(firstScan.range_max.toPrecision(7)),
    };
  }
  return result;
}

/** REP 117: +Inf no return, -Inf too close, NaN invalid; above range_max is no return too. */
function mapRange(range: number, scan: LaserScanMessage, result: TableWriteResult): number | null {
  if (Number.isNaN(range)) result.nullRanges.invalid++;
  else if (range === Number.POSITIVE_INFINITY) result.nullRanges.noReturn++;
  else if (range > scan.range_max) result.nullRanges.aboveMax++;
  else if (range < scan.range_min) result.nullRanges.belowMin++;
  else return Number(float32Text(range));
  return null;
}

function checkSameScanGeometry(
  first: LaserScanMessage,
  scan: LaserScanMessage,
  where: RecordingError['where'],
) {
  const changes: string[] = [];
  if (scan.ranges.length !== first.ranges.length)
    changes.push(`beam count ${first.ranges.length} -> ${scan.ranges.length}`);
  if (scan.angle_min !== first.angle_min) changes.push(`angle_min ${first.angle_min} -> ${scan.angle_min}`);
  if (scan.angle_increment !== first.angle_increment) {
    changes.push(`angle_increment ${first.angle_increment} -> ${scan.angle_increment}`);
  }
  if (changes.length > 0) {
    throw new RecordingError(
      `the scan geometry changed (${changes.join(', ')}); a bundle has one scan block: import the parts before and after with --from/--to`,
      where,
    );
  }
}
