import { mkdirSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { DETECTOR, formatBundle, SCAN_GEOMETRY } from './format-bundle';
import { LONG_SCENARIOS } from './long-scenarios';
import { runScenario, type SimulationRecord } from './run-scenario';
import { HEALTHY_SHIFT, PICKING_LOOP, SAMPLE_SCENARIOS } from './sample-scenarios';
import type { ScenarioSpec } from './scenario-types';

const REPO_ROOT = resolve(fileURLToPath(new URL('.', import.meta.url)), '..', '..');
export const SAMPLE_LOGS_DIR = join(REPO_ROOT, 'sample-logs');

/** Simulates one scenario with the shared sensor settings. */
export function simulateSample(spec: ScenarioSpec): SimulationRecord {
  return runScenario(spec, { scan: SCAN_GEOMETRY, detector: DETECTOR });
}

/** Writes one bundle folder, replacing whatever was there so no stale file survives. */
export function writeBundle(record: SimulationRecord, folder: string): void {
  rmSync(folder, { recursive: true, force: true });
  mkdirSync(folder, { recursive: true });
  for (const [name, content] of formatBundle(record)) writeFileSync(join(folder, name), content);
}

/** catalog.json: each sample's folder, story and injected faults (bundle seconds). */
export function buildCatalog(records: readonly SimulationRecord[]): string {
  const samples = records.map((record) => ({
    folder: record.spec.name,
    story: record.spec.story,
    robot: record.spec.robot.id,
    duration: record.spec.duration,
    faults: record.faults,
    events: record.events.filter((e) => e.kind !== 'operator_note').map((e) => ({ t: e.t, kind: e.kind })),
    reference: { source: 'ceiling-camera-survey', sigma_xy: 0.015, sigma_theta: 0.01, rate_hz: 5 },
  }));
  return `${JSON.stringify({ format: 'driftcase-sample-catalog/1', samples }, null, 2)}\n`;
}

/** Regenerates every committed sample bundle and the catalog under `outDir`. */
export function makeAllSamples(outDir: string = SAMPLE_LOGS_DIR): SimulationRecord[] {
  const records = SAMPLE_SCENARIOS.map(simulateSample);
  mkdirSync(outDir, { recursive: true });
  for (const record of records) writeBundle(record, join(outDir, record.spec.name));
  writeFileSync(join(outDir, 'catalog.json'), buildCatalog(records));
  return records;
}

/**
 * A long healthy bundle for benchmarks: the picking loop repeated for `minutes` (10 min = 6,000
 * scans at 10 Hz). Written to `dir` (by default sample-logs/large/, which git ignores).
 */
export function makeLargeBundle(
  dir: string = join(SAMPLE_LOGS_DIR, 'large'),
  options = { minutes: 10 },
): string {
  const duration = options.minutes * 60;
  const laps = Math.ceil(duration / 60) + 1;
  const route = Array.from({ length: laps }, () => PICKING_LOOP).flat();
  const spec: ScenarioSpec = {
    ...HEALTHY_SHIFT,
    name: `long-shift-${options.minutes}min`,
    story: `${options.minutes}-minute picking shift for benchmarks`,
    duration,
    route,
    scriptedEvents: [],
  };
  const folder = join(dir, spec.name);
  writeBundle(simulateSample(spec), folder);
  return folder;
}

/** Writes one of LONG_SCENARIOS (by name) under `dir` (by default sample-logs/large/, ignored by git). */
export function makeLongBundle(name: string, dir: string = join(SAMPLE_LOGS_DIR, 'large')): string {
  const spec = LONG_SCENARIOS.find((scenario) => scenario.name === name);
  if (!spec)
    throw new Error(`no long scenario "${name}"; known: ${LONG_SCENARIOS.map((s) => s.name).join(', ')}`);
  const folder = join(dir, spec.name);
  writeBundle(simulateSample(spec), folder);
  return folder;
}

function main(args: string[]): number {
  if (args.includes('--long')) {
    console.log(`wrote ${makeLongBundle(args[args.indexOf('--long') + 1] ?? '')}`);
    return 0;
  }
  if (args.includes('--large')) {
    const minutesArg = args[args.indexOf('--large') + 1];
    const minutes = minutesArg && /^\d+$/.test(minutesArg) ? Number(minutesArg) : 10;
    console.log(`wrote ${makeLargeBundle(undefined, { minutes })}`);
    return 0;
  }
  const outIndex = args.indexOf('--out');
  const outDir = outIndex >= 0 && args[outIndex + 1] ? resolve(args[outIndex + 1]) : SAMPLE_LOGS_DIR;
  for (const record of makeAllSamples(outDir)) {
    const faults = record.faults.map((f) => `${f.kind} ${f.start}-${f.end} s`).join('; ') || 'no fault';
    const events = record.events.map((e) => `${e.t}:${e.kind}`).join(' ');
    console.log(`${record.spec.name}: ${faults} | ${events}`);
  }
  return 0;
}

if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  process.exitCode = main(process.argv.slice(2));
}
