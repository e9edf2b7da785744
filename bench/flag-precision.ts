/**
 * Flag precision as a measured property (docs/flags.md, "Precision"): warnings and criticals per
 * healthy hour, per flag kind, on the long healthy runs of tools/simulator/long-scenarios.ts
 * (generated into sample-logs/large/, ignored by git, when missing), and on every faulty sample
 * the time from each injected fault's start to the first flag of the kind meant to catch it.
 * Goal: at most 3 warnings and no critical per healthy hour; every fault flagged within 3 s.
 *
 * `tuning-loop` (10 min) and the samples are where the thresholds were chosen; `hour-loop` only
 * reports them. Run alone with `npx tsx bench/flag-precision.ts` (takes minutes: the hour is
 * 36,000 steps with 2,000 particles), or via `npm run bench -- flag-precision`.
 */
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import type { ReplayFlag } from '../shared/engine/flags/flag-types';
import { makeLongBundle, SAMPLE_LOGS_DIR } from '../tools/simulator/make-samples';
import { flagsOf, replayFolder } from './support/replay-folder';

const PARTICLES = 2000;
const LONG_RUNS = [
  { name: 'tuning-loop', role: 'chose thresholds' },
  { name: 'hour-loop', role: 'checked them once, then the drift rule changed (docs/flags.md)' },
  { name: 'hour-loop-2', role: 'checked them after that change, then the collapse rule changed' },
  { name: 'check-loop-3', role: 'checks them (made after the last change)' },
] as const;
/** The flag kind meant to catch each injected fault kind (as tests/samples/replay-samples.test.ts). */
const EXPECTED_KIND: Record<string, string> = {
  wheel_slip: 'odometry_disagrees_with_scans',
  kidnap: 'odometry_disagrees_with_scans',
  moved_rack: 'map_out_of_date',
  degraded_sensor: 'sensor_evidence_dropped',
};

function countBySeverity(flags: ReplayFlag[], hours: number) {
  const kinds: Record<string, { warning: number; critical: number; info: number }> = {};
  for (const flag of flags) {
    kinds[flag.kind] ??= { warning: 0, critical: 0, info: 0 };
    kinds[flag.kind][flag.severity]++;
  }
  const perHour = (n: number) => Number((n / hours).toFixed(2));
  const total = (severity: 'warning' | 'critical' | 'info') =>
    perHour(flags.filter((f) => f.severity === severity).length);
  return {
    warnings_per_hour: total('warning'),
    criticals_per_hour: total('critical'),
    info_per_hour: total('info'),
    per_kind_per_hour: Object.fromEntries(
      Object.entries(kinds).map(([kind, c]) => [
        kind,
        { warning: perHour(c.warning), critical: perHour(c.critical), info: perHour(c.info) },
      ]),
    ),
  };
}

function measureHealthy(name: string, role: string) {
  const folder = join(SAMPLE_LOGS_DIR, 'large', name);
  if (!existsSync(join(folder, 'manifest.json'))) makeLongBundle(name);
  const replay = replayFolder(folder, { particles: PARTICLES });
  const started = performance.now();
  const flags = flagsOf(replay);
  const steps = replay.series.t.length;
  const hours = (replay.series.t[steps - 1] - replay.series.t[0]) / 3600;
  return {
    name,
    role,
    steps,
    particles: PARTICLES,
    hours: Number(hours.toFixed(3)),
    rmse_reference_m: replay.rmse === null ? null : Number(replay.rmse.toFixed(3)),
    replay_s: Number((replay.replayMs / 1000).toFixed(1)),
    flags_ms: Math.round(performance.now() - started),
    ...countBySeverity(flags, hours),
    warnings_and_criticals: flags
      .filter((f) => f.severity !== 'info')
      .map((f) => `${f.kind} ${f.start.toFixed(1)}-${f.end.toFixed(1)} ${f.severity}`),
  };
}

function measureFaulty() {
  const catalog = JSON.parse(readFileSync(join(SAMPLE_LOGS_DIR, 'catalog.json'), 'utf8')) as {
    samples: { folder: string; faults: { kind: string; start: number; end: number }[] }[];
  };
  return catalog.samples
    .filter((sample) => sample.faults.length > 0)
    .map((sample) => {
      const flags = flagsOf(replayFolder(join(SAMPLE_LOGS_DIR, sample.folder)));
      return {
        name: sample.folder,
        role: 'chose thresholds',
        faults: sample.faults.map((fault) => {
          const near = flags.filter((f) => f.end >= fault.start - 3 && f.start <= fault.end + 3);
          const expected = near.find((f) => f.kind === EXPECTED_KIND[fault.kind]);
          const first = [...near].sort((a, b) => a.start - b.start)[0];
          return {
            kind: fault.kind,
            start: fault.start,
            expected_flag: EXPECTED_KIND[fault.kind],
            seconds_to_expected_flag: expected ? Number((expected.start - fault.start).toFixed(1)) : null,
            expected_flag_severity: expected?.severity ?? null,
            first_flag: first ? first.kind : null,
            seconds_to_first_flag: first ? Number((first.start - fault.start).toFixed(1)) : null,
          };
        }),
      };
    });
}

/** `only`: names of the long runs to measure (all when empty); the faulty samples always run. */
export async function run(only: readonly string[] = []) {
  const chosen = LONG_RUNS.filter((r) => only.length === 0 || only.includes(r.name));
  return [...chosen.map((r) => measureHealthy(r.name, r.role)), ...measureFaulty()];
}

// `npx tsx bench/flag-precision.ts hour-loop-2` measures one long run (each hour takes minutes).
if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const figure of await run(process.argv.slice(2))) process.stdout.write(`${JSON.stringify(figure)}\n`);
}
