/**
 * Replay engine benchmark: a generated 10-minute log (6,000 steps at 10 Hz, 271-beam scans with
 * 60 used, reflector detections every 0.5 s) in an invented 40 m x 20 m warehouse at 0.05 m, with
 * 2,000 particles, on one thread. Prints one JSON line. Target: >= 150 million particle-beam
 * evaluations per second for the whole step (motion, weighting, normalisation, resampling, diagnostics).
 */
import { runReplay } from '../shared/engine/filter';
import { resolveReplaySettings } from '../shared/engine/settings';
import { makeSyntheticBundle } from '../tests/support/engine-fixtures';

export interface EngineBenchFigures {
  name: string;
  steps: number;
  particles: number;
  beams_used: number;
  particle_beam_evaluations: number;
  evaluations_per_second: number;
  wall_ms: number;
  /** CPU time of this process during the replay (user + system); robust when the machine is shared. */
  cpu_ms: number;
  evaluations_per_cpu_second: number;
  peak_rss_mb: number;
  digest: string;
}

export async function run(): Promise<EngineBenchFigures[]> {
  const particles = 2000;
  const bundle = makeSyntheticBundle({ seconds: 599.9, particles, beamsUsed: 60 });
  const resolved = resolveReplaySettings(bundle.manifest, {});
  if (!resolved.ok) throw new Error(resolved.issues.map((i) => `${i.field}: ${i.message}`).join('; '));
  const started = performance.now();
  const cpuBefore = process.cpuUsage();
  let peakRss = process.memoryUsage.rss();
  const result = runReplay(bundle, resolved.settings, {
    onStep: ({ step }) => {
      if (step % 500 === 0) peakRss = Math.max(peakRss, process.memoryUsage.rss());
      return true;
    },
  });
  const wallMs = performance.now() - started;
  const cpu = process.cpuUsage(cpuBefore);
  const cpuMs = (cpu.user + cpu.system) / 1000;
  peakRss = Math.max(peakRss, process.memoryUsage.rss());
  let evaluations = 0;
  for (let k = 0; k < result.steps; k++) {
    // Beams actually evaluated per particle = measurements minus detections of the step.
    evaluations += result.series.particles[k] * result.series.measurements[k];
  }
  return [
    {
      name: 'engine-replay-1-thread',
      steps: result.steps,
      particles,
      beams_used: resolved.settings.scan_model?.beams_used ?? 0,
      particle_beam_evaluations: evaluations,
      evaluations_per_second: Math.round(evaluations / (wallMs / 1000)),
      wall_ms: Math.round(wallMs),
      cpu_ms: Math.round(cpuMs),
      evaluations_per_cpu_second: Math.round(evaluations / (cpuMs / 1000)),
      peak_rss_mb: Math.round(peakRss / 2 ** 20),
      digest: result.digest,
    },
  ];
}
