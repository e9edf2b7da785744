import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { CdrWriter } from '@foxglove/cdr';
import * as zstd from '@foxglove/wasm-zstd';
import { McapWriter, TempBuffer } from '@mcap/core';
import * as lz4 from 'lz4js';

/**
 * Writes a bundle folder as a ROS 2 MCAP recording with the MCAP library's own writer
 * (@mcap/core McapWriter) and CDR bytes laid out by hand with @foxglove/cdr's CdrWriter in the
 * field order of the ROS 2 message definitions: independent of the importer's schema-driven
 * decoder. Same topics and stamps as write-ros1-bag.py.
 */
export interface McapWriteOptions {
  compression: 'zstd' | 'lz4' | 'none';
  scanLimit?: number;
  /** Leave /cmd_vel's schema empty, as some writers do, to exercise the built-in definitions. */
  omitCommandSchema?: boolean;
  /** Make scan number N (0-based) one beam shorter: bad input. */
  shortScanAt?: number;
}

const NS = 1_000_000_000n;
// Chunk compressors from libraries other than the importer's decompressors: zstd from
// @foxglove/wasm-zstd (the reference libzstd in WebAssembly) and lz4 frames from lz4js, the
// frame format MCAP names for "lz4" (MCAP specification, "Chunk" record, compression field).
const CHUNK_COMPRESSORS: Record<
  McapWriteOptions['compression'],
  ((data: Uint8Array) => { compression: string; compressedData: Uint8Array }) | undefined
> = {
  zstd: (data) => ({ compression: 'zstd', compressedData: zstd.compress(data) }),
  lz4: (data) => ({ compression: 'lz4', compressedData: Uint8Array.from(lz4.compress(data)) }),
  none: undefined,
};
const SCHEMAS: Record<string, string> = {
  'tf2_msgs/msg/TFMessage':
    'geometry_msgs/TransformStamped[] transforms\n================================================================================\nMSG: geometry_msgs/TransformStamped\nstd_msgs/Header header\nstring child_frame_id\nTransform transform\n================================================================================\nMSG: std_msgs/Header\nbuiltin_interfaces/Time stamp\nstring frame_id\n================================================================================\nMSG: builtin_interfaces/Time\nint32 sec\nuint32 nanosec\n================================================================================\nMSG: geometry_msgs/Transform\nVector3 translation\nQuaternion rotation\n================================================================================\nMSG: geometry_msgs/Vector3\nfloat64 x\nfloat64 y\nfloat64 z\n================================================================================\nMSG: geometry_msgs/Quaternion\nfloat64 x 0\nfloat64 y 0\nfloat64 z 0\nfloat64 w 1',
  'sensor_msgs/msg/LaserScan':
    'std_msgs/Header header\nfloat32 angle_min\nfloat32 angle_max\nfloat32 angle_increment\nfloat32 time_increment\nfloat32 scan_time\nfloat32 range_min\nfloat32 range_max\nfloat32[] ranges\nfloat32[] intensities\n================================================================================\nMSG: std_msgs/Header\nbuiltin_interfaces/Time stamp\nstring frame_id\n================================================================================\nMSG: builtin_interfaces/Time\nint32 sec\nuint32 nanosec',
  'geometry_msgs/msg/PoseWithCovarianceStamped':
    'std_msgs/Header header\nPoseWithCovariance pose\n================================================================================\nMSG: std_msgs/Header\nbuiltin_interfaces/Time stamp\nstring frame_id\n================================================================================\nMSG: builtin_interfaces/Time\nint32 sec\nuint32 nanosec\n================================================================================\nMSG: geometry_msgs/PoseWithCovariance\nPose pose\nfloat64[36] covariance\n================================================================================\nMSG: geometry_msgs/Pose\nPoint position\nQuaternion orientation\n================================================================================\nMSG: geometry_msgs/Point\nfloat64 x\nfloat64 y\nfloat64 z\n================================================================================\nMSG: geometry_msgs/Quaternion\nfloat64 x 0\nfloat64 y 0\nfloat64 z 0\nfloat64 w 1',
  'geometry_msgs/msg/Twist':
    'Vector3 linear\nVector3 angular\n================================================================================\nMSG: geometry_msgs/Vector3\nfloat64 x\nfloat64 y\nfloat64 z',
  'nav_msgs/msg/OccupancyGrid':
    'std_msgs/Header header\nMapMetaData info\nint8[] data\n================================================================================\nMSG: std_msgs/Header\nbuiltin_interfaces/Time stamp\nstring frame_id\n================================================================================\nMSG: builtin_interfaces/Time\nint32 sec\nuint32 nanosec\n================================================================================\nMSG: nav_msgs/MapMetaData\nbuiltin_interfaces/Time map_load_time\nfloat32 resolution\nuint32 width\nuint32 height\ngeometry_msgs/Pose origin\n================================================================================\nMSG: geometry_msgs/Pose\nPoint position\nQuaternion orientation\n================================================================================\nMSG: geometry_msgs/Point\nfloat64 x\nfloat64 y\nfloat64 z\n================================================================================\nMSG: geometry_msgs/Quaternion\nfloat64 x 0\nfloat64 y 0\nfloat64 z 0\nfloat64 w 1',
};

const header = (w: CdrWriter, stampNs: bigint, frame: string) =>
  w
    .int32(Number(stampNs / NS))
    .uint32(Number(stampNs % NS))
    .string(frame);
const quaternion = (w: CdrWriter, yaw: number) =>
  w
    .float64(0)
    .float64(0)
    .float64(Math.sin(yaw / 2))
    .float64(Math.cos(yaw / 2));

function transform(stampNs: bigint, parent: string, child: string, x: number, y: number, yaw: number) {
  const w = new CdrWriter();
  w.sequenceLength(1);
  header(w, stampNs, parent).string(child);
  w.float64(x).float64(y).float64(0);
  quaternion(w, yaw);
  return w.data;
}

const csvRows = (file: string) => {
  const lines = readFileSync(file, 'utf8').trim().split('\n');
  const names = lines[0].split(',');
  return lines
    .slice(1)
    .map((line) => Object.fromEntries(line.split(',').map((v, i) => [names[i], Number(v)])));
};

export interface EncodedMessage {
  topic: string;
  logTime: bigint;
  data: Uint8Array;
}

export const TOPIC_TYPES: [string, string][] = [
  ['/tf_static', 'tf2_msgs/msg/TFMessage'],
  ['/tf', 'tf2_msgs/msg/TFMessage'],
  ['/scan', 'sensor_msgs/msg/LaserScan'],
  ['/amcl_pose', 'geometry_msgs/msg/PoseWithCovarianceStamped'],
  ['/cmd_vel', 'geometry_msgs/msg/Twist'],
  ['/map', 'nav_msgs/msg/OccupancyGrid'],
];

/** The bundle's rows as CDR messages in log-time order. */
export function encodeBundleMessages(
  bundleFolder: string,
  options: Omit<McapWriteOptions, 'compression'>,
): EncodedMessage[] {
  const manifest = JSON.parse(readFileSync(path.join(bundleFolder, 'manifest.json'), 'utf8'));
  const startNs = BigInt(Date.parse(manifest.start_time)) * 1_000_000n;
  const at = (t: number) => startNs + BigInt(Math.round(t * 1e9));
  const messages: EncodedMessage[] = [];
  const scan = manifest.scan;
  messages.push({
    topic: '/tf_static',
    logTime: startNs,
    data: transform(startNs, 'base_link', 'laser', scan.mount[0], scan.mount[1], scan.mount[2]),
  });

  const map = JSON.parse(readFileSync(path.join(bundleFolder, 'map.json'), 'utf8'));
  const grid = new CdrWriter();
  header(grid, startNs, 'map');
  grid
    .int32(Number(startNs / NS))
    .uint32(0)
    .float32(map.resolution)
    .uint32(map.width)
    .uint32(map.height);
  grid.float64(map.origin[0]).float64(map.origin[1]).float64(0);
  quaternion(grid, 0);
  const code: Record<string, number> = { '.': 0, '#': 100, '?': -1 };
  grid.int8Array(
    [...map.rows].reverse().flatMap((row: string) => [...row].map((c) => code[c])),
    true,
  );
  messages.push({ topic: '/map', logTime: startNs, data: grid.data });

  for (const row of csvRows(path.join(bundleFolder, 'odometry.csv'))) {
    messages.push({
      topic: '/tf',
      logTime: at(row.t),
      data: transform(at(row.t), 'odom', 'base_link', row.x, row.y, row.theta),
    });
  }
  const scanLines = readFileSync(path.join(bundleFolder, 'scans.ndjson'), 'utf8').trim().split('\n');
  scanLines.slice(0, options.scanLimit ?? scanLines.length).forEach((line, index) => {
    const record = JSON.parse(line) as { t: number; ranges: (number | null)[] };
    const ranges = record.ranges.map((r) => (r === null ? Number.POSITIVE_INFINITY : r));
    if (index === options.shortScanAt) ranges.pop();
    const w = new CdrWriter();
    header(w, at(record.t), 'laser');
    w.float32(scan.angle_min)
      .float32(scan.angle_min + scan.angle_increment * (scan.beams - 1))
      .float32(scan.angle_increment);
    w.float32(0).float32(0.1).float32(scan.range_min).float32(scan.range_max);
    w.float32Array(ranges, true).float32Array([], true);
    messages.push({ topic: '/scan', logTime: at(record.t), data: w.data });
  });
  for (const row of csvRows(path.join(bundleFolder, 'onboard_pose.csv'))) {
    const w = new CdrWriter();
    header(w, at(row.t), 'map');
    w.float64(row.x).float64(row.y).float64(0);
    quaternion(w, row.theta);
    const cov = new Array(36).fill(0);
    [cov[0], cov[1], cov[6], cov[7], cov[35]] = [row.cov_xx, row.cov_xy, row.cov_xy, row.cov_yy, row.cov_tt];
    w.float64Array(cov, false);
    messages.push({ topic: '/amcl_pose', logTime: at(row.t), data: w.data });
  }
  for (const row of csvRows(path.join(bundleFolder, 'commands.csv'))) {
    const w = new CdrWriter();
    w.float64(row.v).float64(0).float64(0).float64(0).float64(0).float64(row.omega);
    messages.push({ topic: '/cmd_vel', logTime: at(row.t), data: w.data });
  }
  messages.sort((a, b) => (a.logTime < b.logTime ? -1 : a.logTime > b.logTime ? 1 : 0));
  return messages;
}

export async function writeMcap(
  bundleFolder: string,
  out: string,
  options: McapWriteOptions,
): Promise<string> {
  await zstd.isLoaded;
  const messages = encodeBundleMessages(bundleFolder, options);

  const buffer = new TempBuffer();
  const writer = new McapWriter({
    writable: buffer,
    chunkSize: 256 * 1024,
    compressChunk: CHUNK_COMPRESSORS[options.compression],
  });
  await writer.start({ profile: 'ros2', library: 'driftcase tests' });
  const channelIds = new Map<string, number>();
  for (const [topic, type] of TOPIC_TYPES) {
    const text = topic === '/cmd_vel' && options.omitCommandSchema ? '' : SCHEMAS[type];
    const schemaId = await writer.registerSchema({
      name: type,
      encoding: 'ros2msg',
      data: new TextEncoder().encode(text),
    });
    channelIds.set(
      topic,
      await writer.registerChannel({ topic, schemaId, messageEncoding: 'cdr', metadata: new Map() }),
    );
  }
  let sequence = 0;
  for (const message of messages) {
    await writer.addMessage({
      channelId: channelIds.get(message.topic) as number,
      sequence: sequence++,
      logTime: message.logTime,
      publishTime: message.logTime,
      data: message.data,
    });
  }
  await writer.end();
  writeFileSync(out, buffer.get());
  return out;
}
