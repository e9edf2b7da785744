import { createWriteStream } from 'node:fs';
import { mkdir, mkdtemp, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ZipArchive } from 'archiver';
import { expect } from 'vitest';
import type { BundleIssue } from '../../shared/bundle/types';
import { validateBundleFiles } from '../../shared/bundle/validate-bundle-files';
import { WAREHOUSE_DETECTOR } from './engine-fixtures';

/**
 * Builders for incident bundles in tests and benchmarks: an invented warehouse ("Harbour Row
 * depot", robot "HR-04") driving a slow arc. Deterministic: the same options give the same bytes.
 */
export interface FixtureOptions {
  /** Number of odometry rows and scans, at 10 Hz. */
  steps?: number;
  beams?: number;
}

/** A small deterministic pseudo-random sequence (Park and Miller 1988 minimal standard generator). */
function makeRandom(seed: number): () => number {
  let state = seed;
  return () => {
    state = (state * 16807) % 2147483647;
    return state / 2147483647;
  };
}

export function fixtureManifest(beams = 5): Record<string, unknown> {
  return {
    format: 'incident-bundle/1',
    robot: {
      id: 'HR-04',
      model: 'Tugger T2',
      footprint: { shape: 'circle', radius: 0.35 },
      max_speed: 1.5,
      max_decel: 1.2,
      reaction_time: 0.25,
    },
    site: 'Harbour Row depot',
    start_time: '2026-11-14T09:12:00Z',
    scan: {
      mount: [0.2, 0, 0],
      angle_min: -2.35,
      angle_increment: 4.7 / Math.max(1, beams - 1),
      beams,
      range_min: 0.05,
      range_max: 12,
    },
    // A copy, so a test that breaks its own manifest cannot change the shared detector.
    detector: structuredClone(WAREHOUSE_DETECTOR),
    filter: {
      particles: 500,
      seed: 7,
      motion: { model: 'odometry', alpha: [0.05, 0.01, 0.05, 0.01] },
      scan_model: { model: 'likelihood_field', z_hit: 0.9, z_rand: 0.1, sigma_hit: 0.1, beams_used: 5 },
      resampling: { method: 'systematic', threshold: 0.5 },
      initial: { mode: 'pose', x: 1, y: 1, theta: 0, sigma_xy: 0.2, sigma_theta: 0.1 },
    },
  };
}

export function fixtureMap(): Record<string, unknown> {
  return {
    resolution: 0.5,
    origin: [0, 0],
    width: 8,
    height: 4,
    rows: ['########', '#......#', '#..?...#', '########'],
    landmarks: [
      { id: 'R-1', class: 'reflector', x: 3.5, y: 1.75 },
      { id: 'D-1', class: 'dock', x: 0.5, y: 1.0 },
    ],
  };
}

const wrapAngle = (angle: number) => Math.atan2(Math.sin(angle), Math.cos(angle));
const fixed = (value: number) => value.toFixed(4);

/** A valid bundle as file contents keyed by name. */
export function makeBundleFiles(options: FixtureOptions = {}): Record<string, string> {
  const steps = options.steps ?? 20;
  const beams = options.beams ?? 5;
  const random = makeRandom(12345);
  const odometry = ['t,x,y,theta'];
  const onboard = ['t,x,y,theta,cov_xx,cov_xy,cov_yy,cov_tt'];
  const reference = ['t,x,y,theta,source'];
  const commands = ['t,v,omega'];
  const scans: string[] = [];
  const ranges: string[] = new Array(beams);
  for (let k = 0; k < steps; k++) {
    const t = fixed(k * 0.1);
    const theta = wrapAngle(0.02 * k);
    const x = 1 + 0.05 * k;
    const y = 1 + 0.001 * k * k;
    odometry.push(`${t},${fixed(x)},${fixed(y)},${fixed(theta)}`);
    onboard.push(`${t},${fixed(x + 0.01)},${fixed(y)},${fixed(theta)},0.0100,0.0000,0.0100,0.0025`);
    reference.push(`${t},${fixed(x)},${fixed(y - 0.01)},${fixed(theta)},site camera survey`);
    commands.push(`${t},0.5000,0.2000`);
    for (let b = 0; b < beams; b++) ranges[b] = random() < 0.05 ? 'null' : (0.5 + 3 * random()).toFixed(3);
    scans.push(`{"t":${t},"ranges":[${ranges.join(',')}]}`);
  }
  return {
    'manifest.json': JSON.stringify(fixtureManifest(beams), null, 2),
    'map.json': JSON.stringify(fixtureMap(), null, 2),
    'odometry.csv': `${odometry.join('\n')}\n`,
    'scans.ndjson': `${scans.join('\n')}\n`,
    'detections.csv': 't,class,range,bearing\n0.1,reflector,2.5,0.3\n0.2,dock,1.2,-1.1\n0.3,column,3.0,3.1\n',
    'onboard_pose.csv': `${onboard.join('\n')}\n`,
    'events.csv':
      't,kind,detail\n0.5,warning_field,"person entered slow-down zone, aisle 3"\n0.5,operator_note,picked up by "Dana"\n1.2,contact,bumper front left\n',
    'commands.csv': `${commands.join('\n')}\n`,
    'reference_pose.csv': `${reference.join('\n')}\n`,
  };
}

/** A fresh temporary directory for one test or benchmark run. */
export function makeTempDir(prefix = 'driftcase-bundle-'): Promise<string> {
  return mkdtemp(join(tmpdir(), prefix));
}

/** Writes file contents into `dir` (created if needed) and returns it. */
export async function writeBundleFolder(
  dir: string,
  files: Record<string, string | Buffer>,
): Promise<string> {
  await mkdir(dir, { recursive: true });
  for (const [name, content] of Object.entries(files)) await writeFile(join(dir, name), content);
  return dir;
}

/** Zips file contents with archiver, optionally inside one top-level folder (as when a folder is zipped). */
export async function writeBundleZip(
  zipPath: string,
  files: Record<string, string | Buffer>,
  options: { topFolder?: string; level?: number } = {},
): Promise<string> {
  const archive = new ZipArchive({ zlib: { level: options.level ?? 6 } });
  const output = createWriteStream(zipPath);
  const closed = new Promise<void>((resolve, reject) => {
    output.on('close', resolve);
    archive.on('error', reject);
  });
  archive.pipe(output);
  const prefix = options.topFolder ? `${options.topFolder}/` : '';
  for (const [name, content] of Object.entries(files)) {
    archive.append(typeof content === 'string' ? Buffer.from(content) : content, { name: prefix + name });
  }
  await archive.finalize();
  await closed;
  return zipPath;
}

/** Returns a copy of the files with one replaced (or removed when `content` is undefined). */
export function withFile(
  files: Record<string, string>,
  name: string,
  content: string | undefined,
): Record<string, string> {
  const copy = { ...files };
  if (content === undefined) delete copy[name];
  else copy[name] = content;
  return copy;
}

/** Issues of the valid fixture with one file replaced (or removed when `content` is undefined). */
export function issuesWithFile(name: string, content: string | undefined): BundleIssue[] {
  return validateBundleFiles(withFile(makeBundleFiles(), name, content)).issues;
}

/** Asserts that some issue has all the given fields and a message matching `message`. */
export function expectIssue(issues: BundleIssue[], where: Partial<BundleIssue>, message: RegExp): void {
  const match = issues.find((issue) =>
    Object.entries(where).every(([key, value]) => issue[key as keyof BundleIssue] === value),
  );
  expect(match, `no issue at ${JSON.stringify(where)} in ${JSON.stringify(issues)}`).toBeDefined();
  expect(match!.message).toMatch(message);
}
