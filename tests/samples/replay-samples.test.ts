/**
 * The committed sample incidents, replayed with their manifests' settings: the replay tracks the
 * reference trajectory (a ceiling-camera survey, independent of the robot's sensors), every
 * injected fault in catalog.json is flagged in time, and the healthy run gets no critical flag.
 *
 * Achieved on the committed samples (1000 particles, manifest seeds):
 *   sample            RMSE whole run   RMSE before first fault   divergence
 *   healthy-shift     0.042 m          -                         none
 *   wheel-slip        0.041 m          0.034 m                   none
 *   moved-rack        0.050 m          0.050 m                   none
 *   pushed-aside      0.381 m          0.034 m                   22.5 s (push 22.0-22.6 s)
 *   degraded-sensor   0.039 m          0.037 m                   none
 * pushed-aside's manifest runs without recovery, so after the push the replay (like the robot)
 * stays about 0.7 m off: its whole-run bound is the looser one below.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { validateBundleFiles } from '../../shared/bundle/validate-bundle-files';
import { findDivergenceTime } from '../../shared/engine/divergence';
import { runReplay } from '../../shared/engine/filter';
import { detectFlags } from '../../shared/engine/flags/detect-flags';
import type { ReplayFlag } from '../../shared/engine/flags/flag-types';
import { buildReplayContext } from '../../shared/engine/replay-context';
import { resolveReplaySettings } from '../../shared/engine/settings';
import { rootMeanSquare } from '../../shared/engine/trajectory-error';

const SAMPLES = join(import.meta.dirname, '../../sample-logs');

interface CatalogFault {
  kind: string;
  start: number;
  end: number;
}
interface CatalogSample {
  folder: string;
  faults: CatalogFault[];
  reference?: unknown;
}

/** Tracking bound (m) on the whole-run RMSE: about twice the 0.04-0.05 m achieved. */
const RMSE_BOUND = 0.1;
/** Samples whose manifest filter cannot follow the fault (no recovery) and their looser whole-run bound (m). */
const RMSE_BOUND_AFTER_LOSS: Record<string, number> = { kidnap: 0.5 };
/** The task's timeliness rule: a flag starting within 3 s of the fault's start. */
const FLAG_WITHIN = 3;
/** The flag kind that must catch each injected fault kind. */
const EXPECTED_KIND: Record<string, string> = {
  wheel_slip: 'odometry_disagrees_with_scans',
  kidnap: 'odometry_disagrees_with_scans',
  moved_rack: 'map_out_of_date',
  degraded_sensor: 'sensor_evidence_dropped',
};

const catalog: { samples: CatalogSample[] } = JSON.parse(readFileSync(join(SAMPLES, 'catalog.json'), 'utf8'));
const withReference = catalog.samples.filter((sample) => sample.reference);

function replaySample(folder: string) {
  const files: Record<string, string> = {};
  for (const name of readdirSync(join(SAMPLES, folder)))
    files[name] = readFileSync(join(SAMPLES, folder, name), 'utf8');
  const read = validateBundleFiles(files);
  if (!read.ok || !read.bundle)
    throw new Error(`${folder} does not read: ${JSON.stringify(read.issues.slice(0, 3))}`);
  const resolved = resolveReplaySettings(read.bundle.manifest);
  if (!resolved.ok) throw new Error(`${folder} settings: ${JSON.stringify(resolved.issues)}`);
  const context = buildReplayContext(read.bundle, resolved.settings);
  const result = runReplay(read.bundle, resolved.settings, { context, keyframeInterval: 0 });
  const flags = detectFlags({
    bundle: read.bundle,
    series: result.series,
    settings: resolved.settings,
    neesBound: result.neesBound,
    context,
  });
  return { result, flags };
}

function rmseBefore(t: Float64Array, error: Float64Array, until: number): number | null {
  let last = 0;
  while (last < t.length && t[last] < until) last++;
  return rootMeanSquare(error.subarray(0, last));
}

const describeFlags = (flags: ReplayFlag[]) =>
  flags
    .map((flag) => `${flag.kind} ${flag.start.toFixed(1)}-${flag.end.toFixed(1)} ${flag.severity}`)
    .join('; ');

it('the catalog lists samples with a reference trajectory, including a healthy one', () => {
  expect(withReference.length).toBeGreaterThanOrEqual(2);
  expect(withReference.some((sample) => sample.faults.length === 0)).toBe(true);
});

describe.each(withReference.map((sample) => [sample.folder, sample] as const))('%s', (_folder, sample) => {
  let run: ReturnType<typeof replaySample>;
  beforeAll(() => {
    run = replaySample(sample.folder);
  }, 120_000);

  const firstFault = Math.min(...sample.faults.map((fault) => fault.start));
  const lostKinds = sample.faults.map((fault) => RMSE_BOUND_AFTER_LOSS[fault.kind]).filter(Boolean);
  const bound = lostKinds.length > 0 ? Math.max(...lostKinds) : RMSE_BOUND;

  it(`tracks the reference: whole-run RMSE below ${bound} m`, () => {
    expect(run.result.metrics.rmse_reference).not.toBeNull();
    expect(run.result.metrics.rmse_reference!).toBeLessThan(bound);
  });

  // Only where it applies: a sample without faults has no "before the fault", and so on.
  if (sample.faults.length > 0) {
    it(`tracks the reference before the first fault: RMSE below ${RMSE_BOUND} m`, () => {
      const { t, error_reference } = run.result.series;
      expect(rmseBefore(t, error_reference, firstFault)!).toBeLessThan(RMSE_BOUND);
    });
  }

  it.each(sample.faults.map((fault) => [fault.kind, fault] as const))(
    'flags the injected %s within 3 s of its start',
    (kind, fault) => {
      const expected = EXPECTED_KIND[kind];
      expect(expected, `no expected flag kind is defined for fault kind ${kind}`).toBeDefined();
      const timely = run.flags.filter(
        (flag) => flag.kind === expected && Math.abs(flag.start - fault.start) <= FLAG_WITHIN,
      );
      expect(timely, `flags were: ${describeFlags(run.flags)}`).not.toEqual([]);
    },
  );

  // Only where it applies: a sample without faults has no "before the fault", and so on.
  if (sample.faults.length === 0) {
    it('raises no critical flag, at most 3 warnings, and never diverges', () => {
      const critical = run.flags.filter((flag) => flag.severity === 'critical');
      expect(critical, describeFlags(critical)).toEqual([]);
      // The precision goal of docs/flags.md is per hour; a shorter healthy log must not exceed it either.
      const warnings = run.flags.filter((flag) => flag.severity === 'warning');
      expect(warnings.length, describeFlags(warnings)).toBeLessThanOrEqual(3);
      expect(findDivergenceTime(run.result.series.t, run.result.series.error_reference)).toBeNull();
    });
  }

  if (sample.faults.some((fault) => fault.kind === 'moved_rack')) {
    it('reports the moved rack as one structure-sized object standing where the map has the cross aisle', () => {
      // Ground truth from the scenario (tools/simulator/site-layout.ts, sample-scenarios.ts): rack
      // row B (y 7.6-8.8 m) east block moved from x 18.0 m to 16.8 m, so it now stands in the mapped
      // cross aisle, x 16.8-18.0 m.
      const objects = run.flags.filter((flag) => flag.kind === 'map_out_of_date');
      expect(objects, describeFlags(run.flags)).toHaveLength(1);
      const [rack] = objects;
      expect(rack.severity).toBe('critical');
      expect(rack.size!).toBeGreaterThanOrEqual(1);
      expect(rack.location!.x).toBeGreaterThanOrEqual(16.7);
      expect(rack.location!.x).toBeLessThanOrEqual(18.1);
      expect(rack.location!.y).toBeGreaterThanOrEqual(7.5);
      expect(rack.location!.y).toBeLessThanOrEqual(8.9);
      expect(rack.sightings!.length).toBeGreaterThanOrEqual(1);
      expect(rack.sightings![0].start).toBe(rack.start);
      expect(rack.evidence).toMatch(/^Unmapped object about \d+\.\d m across at \(/);
    });
  }

  // Only where it applies: a sample without faults has no "before the fault", and so on.
  if (sample.faults.some((fault) => fault.kind === 'kidnap')) {
    it('dates the divergence inside the kidnap window', () => {
      const kidnap = sample.faults.find((fault) => fault.kind === 'kidnap')!;
      const diverged = findDivergenceTime(run.result.series.t, run.result.series.error_reference);
      expect(diverged).not.toBeNull();
      expect(diverged!).toBeGreaterThanOrEqual(kidnap.start);
      expect(diverged!).toBeLessThanOrEqual(kidnap.end);
    });
  }
});
