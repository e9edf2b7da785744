/**
 * Peak memory of `import` on a large generated MCAP recording (zstd chunks, indexed): an invented
 * robot "Wren" driving a slow circle with 10 Hz /tf and 1081-beam /scan. The file is streamed to
 * disk while it is written, then imported in a fresh child process so the peak RSS belongs to the
 * importer alone. Size: RECORDING_BENCH_MB (default 1200: zstd shrinks the written bytes to about 87 %, so the file is just over 1 GiB). Standalone:
 * `RECORDING_BENCH_MB=200 npx tsx bench/recording-import-memory.ts`.
 */
import { execFile } from 'node:child_process';
import { mkdtemp, open, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { promisify } from 'node:util';
import { CdrWriter } from '@foxglove/cdr';
import * as zstd from '@foxglove/wasm-zstd';
import { McapWriter } from '@mcap/core';
import { FileHandleWritable } from '@mcap/nodejs';
import { BUILTIN_ROS2_DEFINITIONS } from '../api/src/recordings/builtin-definitions';

const BEAMS = 1081;
const NS = 1_000_000_000n;

async function writeLargeMcap(file: string, targetBytes: number): Promise<number> {
  await zstd.isLoaded;
  const handle = await open(file, 'w');
  const writer = new McapWriter({
    writable: new FileHandleWritable(handle),
    chunkSize: 4 * 1024 * 1024,
    compressChunk: (data) => ({ compression: 'zstd', compressedData: zstd.compress(data, 1) }),
  });
  await writer.start({ profile: 'ros2', library: 'driftcase bench' });
  const channel = async (topic: string, type: string) =>
    writer.registerChannel({
      topic,
      messageEncoding: 'cdr',
      metadata: new Map(),
      schemaId: await writer.registerSchema({
        name: type.replace('/', '/msg/'),
        encoding: 'ros2msg',
        data: new TextEncoder().encode(BUILTIN_ROS2_DEFINITIONS[type]),
      }),
    });
  const tf = await channel('/tf', 'tf2_msgs/TFMessage');
  const scan = await channel('/scan', 'sensor_msgs/LaserScan');
  const start = 1_800_000_000n * NS;
  let written = 0;
  let steps = 0;
  const ranges = new Float32Array(BEAMS);
  let noise = 12345;
  for (let k = 0; written < targetBytes; k++) {
    const stamp = start + BigInt(k) * 100_000_000n;
    const sec = Number(stamp / NS);
    const nanosec = Number(stamp % NS);
    const angle = k * 0.001;
    const t = new CdrWriter();
    t.sequenceLength(1).int32(sec).uint32(nanosec).string('odom').string('base_link');
    t.float64(5 * Math.cos(angle))
      .float64(5 * Math.sin(angle))
      .float64(0);
    t.float64(0)
      .float64(0)
      .float64(Math.sin((angle + Math.PI / 2) / 2))
      .float64(Math.cos((angle + Math.PI / 2) / 2));
    await writer.addMessage({ channelId: tf, sequence: k, logTime: stamp, publishTime: stamp, data: t.data });
    // Noisy ranges (a fixed linear congruential sequence) so zstd cannot shrink the file below
    // the size asked for: a real scanner's ranges carry sensor noise in their low bits too.
    for (let b = 0; b < BEAMS; b++) {
      noise = (Math.imul(noise, 1664525) + 1013904223) >>> 0;
      ranges[b] = 2 + noise / 2 ** 29;
    }
    const s = new CdrWriter({ size: BEAMS * 4 + 128 });
    s.int32(sec).uint32(nanosec).string('base_link');
    s.float32(-2.35)
      .float32(2.35)
      .float32(4.7 / (BEAMS - 1))
      .float32(0)
      .float32(0.1)
      .float32(0.05)
      .float32(30);
    s.float32Array(ranges, true).float32Array([], true);
    await writer.addMessage({
      channelId: scan,
      sequence: k,
      logTime: stamp,
      publishTime: stamp,
      data: s.data,
    });
    written += s.data.byteLength + t.data.byteLength;
    steps++;
  }
  await writer.end();
  await handle.close();
  return steps;
}

export async function run() {
  const targetMb = Number(process.env.RECORDING_BENCH_MB ?? 1200);
  const dir = await mkdtemp(join(tmpdir(), 'dc-bench-rec-'));
  try {
    const source = join(dir, 'wren.mcap');
    const steps = await writeLargeMcap(source, targetMb * 1024 * 1024);
    const { size } = await stat(source);
    const map = join(dir, 'map.yaml');
    await writeFile(
      join(dir, 'map.pgm'),
      Buffer.concat([Buffer.from('P5\n40 40\n255\n'), Buffer.alloc(1600, 254)]),
    );
    await writeFile(
      map,
      'image: map.pgm\nresolution: 0.5\norigin: [-10, -10, 0]\nnegate: 0\noccupied_thresh: 0.65\nfree_thresh: 0.196\n',
    );
    const importer = pathToFileURL(
      fileURLToPath(new URL('../api/src/recordings/import-recording.ts', import.meta.url)),
    ).href;
    const script = `const { importRecording } = await import(${JSON.stringify(importer)});
      const started = performance.now();
      const summary = await importRecording({ source: ${JSON.stringify(source)}, map: ${JSON.stringify(map)}, out: ${JSON.stringify(join(dir, 'out.zip'))} });
      process.stdout.write(JSON.stringify({ ms: performance.now() - started, rows: summary.rows, maxRssKb: process.resourceUsage().maxRSS }));`;
    const { stdout } = await promisify(execFile)(
      process.execPath,
      ['--import', 'tsx', '--input-type=module', '-e', script],
      {
        maxBuffer: 1 << 20,
        timeout: 3_600_000,
      },
    );
    const result = JSON.parse(stdout);
    return {
      case: 'import a generated MCAP recording (zstd, indexed)',
      recording_mb: Math.round(size / 1024 / 1024),
      messages: steps * 2,
      peak_rss_mb: Math.round(result.maxRssKb / 1024),
      seconds: Math.round(result.ms / 100) / 10,
      rows: result.rows,
    };
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

if (import.meta.url === pathToFileURL(process.argv[1]).href) {
  run().then((figure) => process.stdout.write(`${JSON.stringify(figure)}\n`));
}
