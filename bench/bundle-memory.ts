/**
 * Peak memory and time of `inspectBundle` on a 10-minute recording: 10 Hz odometry and 271-beam
 * scans (6,000 scans), zipped. The bundle is generated here (invented robot "QB-9" at an invented
 * "Kestrel Lane cold store"), then inspected in a fresh child process so the peak RSS belongs to the
 * reader alone. Standalone: `npx tsx bench/bundle-memory.ts`; also picked up by bench/run-all.ts.
 */
import { execFile } from 'node:child_process';
import { createReadStream, createWriteStream } from 'node:fs';
import { mkdtemp, rm, stat, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { promisify } from 'node:util';
import { ZipArchive } from 'archiver';
import { inspectBundle } from '../api/src/bundles/inspect-bundle';

const DURATION_S = 600;
const RATE_HZ = 10;
const BEAMS = 271;

const manifest = {
  format: 'incident-bundle/1',
  robot: {
    id: 'QB-9',
    model: 'Courier C1',
    footprint: { shape: 'rectangle', length: 0.9, width: 0.6 },
    max_speed: 1.2,
    max_decel: 1.0,
    reaction_time: 0.3,
  },
  site: 'Kestrel Lane cold store',
  start_time: '2026-03-02T05:40:00Z',
  scan: {
    mount: [0.25, 0, 0],
    angle_min: -2.356,
    angle_increment: 0.01745,
    beams: BEAMS,
    range_min: 0.05,
    range_max: 20,
  },
  filter: {
    particles: 1000,
    seed: 3,
    motion: { model: 'odometry', alpha: [0.05, 0.01, 0.05, 0.01] },
    resampling: { method: 'systematic', threshold: 0.5 },
    initial: { mode: 'pose', x: 2, y: 2, theta: 0, sigma_xy: 0.2, sigma_theta: 0.1 },
  },
};

function gridRows(width: number, height: number): string[] {
  return Array.from({ length: height }, (_, i) =>
    Array.from({ length: width }, (_, j) =>
      i === 0 || j === 0 || i === height - 1 || j === width - 1 ? '#' : '.',
    ).join(''),
  );
}

async function writeLines(
  path: string,
  header: string | undefined,
  count: number,
  line: (k: number) => string,
) {
  const out = createWriteStream(path);
  if (header) out.write(`${header}\n`);
  for (let k = 0; k < count; k++)
    if (!out.write(`${line(k)}\n`)) await new Promise<void>((resolve) => out.once('drain', () => resolve()));
  await new Promise((resolve) => out.end(resolve));
}

/** Writes the bundle files into `dir`, line by line; deterministic (Park and Miller 1988 minimal standard generator). */
async function generateBundle(dir: string): Promise<string[]> {
  const steps = DURATION_S * RATE_HZ;
  let state = 1;
  const noise = () => {
    state = (state * 16807) % 2147483647; // product stays below 2^53, so it is exact in a double
    return state / 2147483647;
  };
  await writeFile(join(dir, 'manifest.json'), JSON.stringify(manifest, null, 2));
  await writeFile(
    join(dir, 'map.json'),
    JSON.stringify({
      resolution: 0.05,
      origin: [0, 0],
      width: 400,
      height: 200,
      rows: gridRows(400, 200),
      landmarks: [],
    }),
  );
  const pose = (k: number) => {
    const theta = Math.atan2(Math.sin(k * 0.002), Math.cos(k * 0.002));
    return `${(k / RATE_HZ).toFixed(2)},${(2 + 0.03 * k * 0.01).toFixed(4)},${(2 + Math.sin(k * 0.001)).toFixed(4)},${theta.toFixed(5)}`;
  };
  await writeLines(join(dir, 'odometry.csv'), 't,x,y,theta', steps, pose);
  await writeLines(
    join(dir, 'commands.csv'),
    't,v,omega',
    steps,
    (k) => `${(k / RATE_HZ).toFixed(2)},0.3000,0.0200`,
  );
  const ranges: string[] = new Array(BEAMS);
  await writeLines(join(dir, 'scans.ndjson'), undefined, steps, (k) => {
    for (let b = 0; b < BEAMS; b++) ranges[b] = noise() < 0.03 ? 'null' : (0.3 + 9 * noise()).toFixed(3);
    return `{"t":${(k / RATE_HZ).toFixed(2)},"ranges":[${ranges.join(',')}]}`;
  });
  return ['manifest.json', 'map.json', 'odometry.csv', 'commands.csv', 'scans.ndjson'];
}

async function zipFolder(dir: string, names: string[], zipPath: string): Promise<void> {
  const archive = new ZipArchive({ zlib: { level: 6 } });
  const output = createWriteStream(zipPath);
  const closed = new Promise<void>((resolve, reject) => {
    output.on('close', () => resolve());
    archive.on('error', reject);
  });
  archive.pipe(output);
  for (const name of names) archive.append(createReadStream(join(dir, name)), { name });
  await archive.finalize();
  await closed;
}

/** Child-process side: inspect one zip and print one JSON line of figures. */
async function measure(zipPath: string): Promise<void> {
  const rssBeforeKiB = Math.round(process.memoryUsage().rss / 1024);
  const started = performance.now();
  const inspection = await inspectBundle({ kind: 'zip', path: zipPath });
  const elapsedMs = Math.round(performance.now() - started);
  const unpackedBytes = inspection.files.reduce((total, file) => total + file.size, 0);
  process.stdout.write(
    `${JSON.stringify({ ok: inspection.ok, scans: inspection.bundle?.scans?.count, unpackedBytes, elapsedMs, rssBeforeKiB, peakRssKiB: process.resourceUsage().maxRSS })}\n`,
  );
}

export async function run(): Promise<object[]> {
  const dir = await mkdtemp(join(tmpdir(), 'driftcase-bench-bundle-'));
  try {
    const names = await generateBundle(dir);
    const zipPath = join(dir, 'ten-minutes.zip');
    await zipFolder(dir, names, zipPath);
    const zipBytes = (await stat(zipPath)).size;
    const self = fileURLToPath(import.meta.url);
    const { stdout } = await promisify(execFile)(
      process.execPath,
      ['--import', 'tsx', self, '--measure', zipPath],
      { maxBuffer: 1 << 20 },
    );
    const figures = JSON.parse(stdout.trim().split('\n').pop()!);
    return [{ name: 'inspect 10-minute bundle (6,000 scans x 271 beams, zip)', zipBytes, ...figures }];
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

const isMain = process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href;
if (isMain) {
  const at = process.argv.indexOf('--measure');
  if (at !== -1) await measure(process.argv[at + 1]);
  else for (const figure of await run()) process.stdout.write(`${JSON.stringify(figure)}\n`);
}
