/**
 * Replay engine benchmark: a generated 10-minute log (6,000 steps at 10 Hz, 271-beam scans with
 * 60 used, reflector detections every 0.5 s) in an invented 40 m x 20 m warehouse at 0.05 m, with
 * 2,000 particles, on one thread. Target: >= 150 million particle-beam evaluations per second for
 * the whole step (motion, weighting, normalisation, resampling, diagnostics), counting every used
 * beam of every scan (6,000 x 2,000 x 60 = 720 M), i.e. about 4.8 s for the run.
 *
 * The machine is shared, so CPU time of this process is reported beside wall time, with the load
 * average. Run alone with `npx tsx bench/engine-bench.ts`, or through `npm run bench`.
 */
import { loadavg } from 'node:os';
import { pathToFileURL } from 'node:url';
import { runReplay } from '../shared/engine/filter';
import { buildReplayContext } from '../shared/engine/replay-context';
import { resolveReplaySettings } from '../shared/engine/settings';
import { makeSyntheticBundle } from '../tests/support/engine-fixtures';

export interface EngineBenchFigures {
  name: string;
  steps: number;
  particles: number;
  beams_used: number;
  /** Particles x used beams x scans, summed over steps: every used beam counts. */
  particle_beam_evaluations: number;
  /** The part of those actually looked up (beams with no return or at max range are skipped). */
  particle_beam_lookups: number;
  particle_detection_evaluations: number;
  evaluations_per_second: number;
  evaluations_per_cpu_second: number;
  lookups_per_cpu_second: number;
  wall_ms: number;
  /** CPU time of this process during the replay (user + system); robust when the machine is shared. */
  cpu_ms: number;
  peak_rss_mb: number;
  /** 1-minute load average before and after the run (2 cores here). */
  load_average: [number, number];
  digest: string;
}

export async function run(): Promise<EngineBenchFigures[]> {
  const particles = 2000;
  const bundle = makeSyntheticBundle({ seconds: 599.9, particles, beamsUsed: 60 });
  const resolved = resolveReplaySettings(bundle.manifest, {});
  if (!resolved.ok) throw new Error(resolved.issues.map((i) => `${i.field}: ${i.message}`).join('; '));
  const settings = resolved.settings;
  const loadBefore = loadavg()[0];
  const started = performance.now();
  const cpuBefore = process.cpuUsage();
  let peakRss = process.memoryUsage.rss();
  const context = buildReplayContext(bundle, settings);
  const result = runReplay(bundle, settings, {
    context,
    onStep: ({ step }) => {
      if (step % 500 === 0) peakRss = Math.max(peakRss, process.memoryUsage.rss());
      return true;
    },
  });
  const wallMs = performance.now() - started;
  const cpu = process.cpuUsage(cpuBefore);
  const cpuMs = (cpu.user + cpu.system) / 1000;
  peakRss = Math.max(peakRss, process.memoryUsage.rss());
  const beamsUsed = settings.scan_model?.beams_used ?? 0;
  const { scanStart, detectionStart } = context.timeline;
  let evaluations = 0;
  let lookups = 0;
  let detectionEvaluations = 0;
  for (let k = 0; k < result.steps; k++) {
    // Particles during step k's weighting = the count after step k-1 (the initial count at step 0).
    const weighed = k === 0 ? settings.particles : result.series.particles[k - 1];
    const detections = detectionStart[k + 1] - detectionStart[k];
    evaluations += weighed * beamsUsed * (scanStart[k + 1] - scanStart[k]);
    lookups += weighed * (result.series.measurements[k] - detections);
    detectionEvaluations += weighed * detections;
  }
  return [
    {
      name: 'engine-replay-1-thread',
      steps: result.steps,
      particles,
      beams_used: beamsUsed,
      particle_beam_evaluations: evaluations,
      particle_beam_lookups: lookups,
      particle_detection_evaluations: detectionEvaluations,
      evaluations_per_second: Math.round(evaluations / (wallMs / 1000)),
      evaluations_per_cpu_second: Math.round(evaluations / (cpuMs / 1000)),
      lookups_per_cpu_second: Math.round(lookups / (cpuMs / 1000)),
      wall_ms: Math.round(wallMs),
      cpu_ms: Math.round(cpuMs),
      peak_rss_mb: Math.round(peakRss / 2 ** 20),
      load_average: [Number(loadBefore.toFixed(2)), Number(loadavg()[0].toFixed(2))],
      digest: result.digest,
    },
  ];
}

if (import.meta.url === pathToFileURL(process.argv[1] ?? '').href) {
  run().then(
    (figures) => {
      for (const figure of figures) process.stdout.write(`${JSON.stringify(figure)}\n`);
    },
    (error: unknown) => {
      process.stderr.write(`benchmark failed: ${error instanceof Error ? error.message : String(error)}\n`);
      process.exitCode = 1;
    },
  );
}
