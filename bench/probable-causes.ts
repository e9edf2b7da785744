/**
 * Probable-causes benchmark: a generated 10-minute log (6,000 steps at 10 Hz, 2,000 particles,
 * as in engine-bench.ts) is replayed once (not timed), then the cause search is timed twice:
 * on the replay's own flags, and on a worst case where MAX_FLAGS_PER_KIND long flags of every
 * kind a cause starts from are added, so every counterfactual the search can run is run.
 * Target (issue 15): causes for a 10-minute replay in under 10 s on this machine.
 * Run alone with `npx tsx bench/probable-causes.ts`, or via `npm run bench`.
 */
import { loadavg } from 'node:os';
import { pathToFileURL } from 'node:url';
import { replayBundle } from '../shared/engine';
import type { CauseFlag } from '../shared/engine/causes/cause-types';
import { findProbableCauses, MAX_FLAGS_PER_KIND } from '../shared/engine/causes/find-probable-causes';
import { detectFlags } from '../shared/engine/flags/detect-flags';
import { makeSyntheticBundle } from '../tests/support/engine-fixtures';

const PARTICLES = 2000;
/** Length (s) of each added worst-case flag: longer than any counterfactual span. */
const LONG_FLAG_SECONDS = 30;
const STARTING_KINDS = [
  'odometry_disagrees_with_scans',
  'map_out_of_date',
  'sensor_evidence_dropped',
  'onboard_departed_from_replay',
];

export async function run() {
  const bundle = makeSyntheticBundle({ seconds: 599.9, particles: PARTICLES, beamsUsed: 60 });
  const replay = replayBundle(bundle, {}, { keyframeInterval: 0 });
  const flags: CauseFlag[] = detectFlags({ ...replay, context: replay.context });
  const { t, x, y } = replay.series;
  const added: CauseFlag[] = STARTING_KINDS.flatMap((kind, k) =>
    Array.from({ length: MAX_FLAGS_PER_KIND }, (_, i) => {
      const step = Math.floor(((k * MAX_FLAGS_PER_KIND + i + 0.5) / (4 * MAX_FLAGS_PER_KIND)) * t.length);
      return {
        kind,
        start: t[step],
        end: t[step] + LONG_FLAG_SECONDS,
        severity: 'warning' as const,
        evidence: 'benchmark',
        location: { x: x[step] + 1, y: y[step] },
        size: 1.2,
      };
    }),
  );
  const figures = [];
  for (const [name, used] of [
    ['own-flags', flags],
    ['worst-case-flags', [...flags, ...added]],
  ] as const) {
    const load = loadavg()[0];
    const started = performance.now();
    const causes = findProbableCauses({ ...replay, flags: used });
    const wallMs = performance.now() - started;
    figures.push({
      name,
      steps: replay.steps,
      particles: PARTICLES,
      flags: used.length,
      causes: causes.length,
      counterfactuals_cited: causes.reduce((sum, cause) => sum + cause.counterfactuals.length, 0),
      wall_ms: Math.round(wallMs),
      target_ms: 10_000,
      load_average: [load, loadavg()[0]],
    });
  }
  return figures;
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  for (const figure of await run()) process.stdout.write(`${JSON.stringify(figure)}\n`);
}
