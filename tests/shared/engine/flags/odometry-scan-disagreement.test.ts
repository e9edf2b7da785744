import { describe, expect, it } from 'vitest';
import { measureEvidenceProfile } from '../../../../shared/engine/flags/evidence-profile';
import { countFreeSpaceEndpoints } from '../../../../shared/engine/flags/map-out-of-date';
import { detectOdometryScanDisagreement } from '../../../../shared/engine/flags/odometry-scan-disagreement';
import { createScanMatchWorkspace, findScanOffset } from '../../../../shared/engine/flags/scan-match-offset';
import { buildReplayContext } from '../../../../shared/engine/replay-context';
import { createReplaySeries } from '../../../../shared/engine/replay-series';
import { resolveReplaySettings } from '../../../../shared/engine/settings';
import { makeSyntheticBundle } from '../../../support/engine-fixtures';
import { forEachStep, makeHealthySeries } from './synthetic-series';

/** A synthetic warehouse run and a series whose mean pose is the simulated true pose. */
function truthReplay(seconds: number) {
  const bundle = makeSyntheticBundle({ seconds, withPoses: true, particles: 200 });
  const resolved = resolveReplaySettings(bundle.manifest);
  if (!resolved.ok) throw new Error('synthetic manifest has invalid settings');
  const context = buildReplayContext(bundle, resolved.settings);
  const steps = bundle.odometry.t.length;
  const series = createReplaySeries(steps);
  const truth = bundle.reference!;
  for (let k = 0; k < steps; k++) {
    series.t[k] = bundle.odometry.t[k];
    series.x[k] = truth.x[k];
    series.y[k] = truth.y[k];
    series.theta[k] = truth.theta[k];
    series.measurements[k] = 60;
    series.log_likelihood[k] = 60;
    series.particles[k] = 200;
  }
  return { context, series };
}

describe('findScanOffset', () => {
  const { context, series } = truthReplay(4);
  const work = createScanMatchWorkspace(context.beams!.indices.length);

  it('finds no offset at the true pose (the simulated truth fits best)', () => {
    const offset = findScanOffset(context, series, 20, work, 20)!;
    expect(offset.gainPerEndpoint).toBeLessThan(0.3);
    expect(Math.hypot(offset.dx, offset.dy)).toBeLessThanOrEqual(0.1);
    expect(Math.abs(offset.dtheta)).toBeLessThanOrEqual(0.05);
  });

  it('recovers a known sideways and heading displacement of the mean pose', () => {
    // At step 20 the robot drives east along the south shelving (y about 3.1 m, heading 0.09 rad).
    series.y[20] += 0.4;
    series.theta[20] += 0.1;
    const offset = findScanOffset(context, series, 20, work, 20)!;
    expect(offset.dx).toBeCloseTo(0, 1);
    expect(offset.dy).toBeCloseTo(-0.4, 1);
    expect(offset.dtheta).toBeCloseTo(-0.1, 1);
    expect(offset.gainPerEndpoint).toBeGreaterThan(0.3);
  });

  it('reports no offset along the aisle, where the scan cannot tell (prior toward the mean pose)', () => {
    series.x[20] = series.x[19] + 0.4;
    series.y[20] = series.y[19];
    series.theta[20] = series.theta[19];
    const offset = findScanOffset(context, series, 20, work, 20)!;
    expect(offset.gainPerEndpoint).toBeLessThan(0.3);
  });
});

describe('detectOdometryScanDisagreement', () => {
  it('flags measurement updates that keep turning the robot one way (slip)', () => {
    const series = makeHealthySeries(40);
    forEachStep(20, 23, (k) => {
      series.correction_theta[k] = -0.03;
    });
    const flags = detectOdometryScanDisagreement(
      series,
      measureEvidenceProfile(series),
      undefined,
      undefined,
    );
    expect(flags).toHaveLength(1);
    // The 1 s sum passes 0.12 rad on the 4th or 5th step of -0.03 rad (the wobble adds +-0.003).
    expect(flags[0].start).toBeGreaterThanOrEqual(20.3 - 1e-9);
    expect(flags[0].start).toBeLessThanOrEqual(20.4 + 1e-9);
    expect(flags[0].kind).toBe('odometry_disagrees_with_scans');
  });

  it('stays quiet when corrections are small and unbiased', () => {
    const series = makeHealthySeries(40);
    expect(
      detectOdometryScanDisagreement(series, measureEvidenceProfile(series), undefined, undefined),
    ).toEqual([]);
  });

  it('flags a push: the replay stays put, the scans place the robot 0.6 m aside', () => {
    const { context, series } = truthReplay(30);
    forEachStep(20, 23, (k) => {
      series.y[k] += 0.6;
      series.log_likelihood[k] = -150;
    });
    const counts = countFreeSpaceEndpoints(context, series);
    const flags = detectOdometryScanDisagreement(series, measureEvidenceProfile(series), context, counts);
    expect(flags).toHaveLength(1);
    expect(flags[0].start).toBeGreaterThanOrEqual(20);
    expect(flags[0].start).toBeLessThan(20.5);
    expect(flags[0].severity).toBe('critical');
    expect(flags[0].evidence).toMatch(/fit best up to 0\.[56]\d m/);
  });
});
