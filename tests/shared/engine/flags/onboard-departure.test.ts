import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import {
  detectOnboardDepartureFromReference,
  detectOnboardDepartureFromReplay,
} from '../../../../shared/engine/flags/onboard-departure';
import { NEES_BOUND_95 } from '../../../../shared/engine/trajectory-error';
import { makeSyntheticBundle } from '../../../support/engine-fixtures';
import { forEachStep, makeHealthySeries } from './synthetic-series';

describe('detectOnboardDepartureFromReplay', () => {
  it('uses the 95 % chi-square bound for 3 dof', () => {
    // NIST/SEMATECH e-Handbook, chi-square table: 7.815 for 3 dof at 95 %; jstat agrees.
    expect(NEES_BOUND_95).toBeCloseTo(7.815, 3);
    expect(NEES_BOUND_95).toBeCloseTo(jStat.chisquare.inv(0.95, 3), 6);
  });

  it('flags an onboard estimate that stays far from the replay, with its consistency', () => {
    const series = makeHealthySeries(60);
    forEachStep(20, 30, (k) => {
      series.error_onboard[k] = 0.6;
      series.nees_onboard[k] = 40;
    });
    const flags = detectOnboardDepartureFromReplay(series, NEES_BOUND_95);
    expect(flags).toHaveLength(1);
    expect(flags[0]).toMatchObject({ kind: 'onboard_departed_from_replay', start: 20, severity: 'warning' });
    expect(flags[0].evidence).toContain('max 0.60 m');
    expect(flags[0].evidence).toContain('in 100 % of steps');
  });

  it('is critical beyond 1 m and silent for healthy agreement', () => {
    const series = makeHealthySeries(60);
    expect(detectOnboardDepartureFromReplay(series, NEES_BOUND_95)).toEqual([]);
    forEachStep(20, 25, (k) => {
      series.error_onboard[k] = 1.2;
    });
    expect(detectOnboardDepartureFromReplay(series, NEES_BOUND_95)[0].severity).toBe('critical');
  });

  it('does not flag a short excursion', () => {
    const series = makeHealthySeries(60);
    forEachStep(20, 20.5, (k) => {
      series.error_onboard[k] = 2;
    });
    expect(detectOnboardDepartureFromReplay(series, NEES_BOUND_95)).toEqual([]);
  });
});

describe('detectOnboardDepartureFromReference', () => {
  it('compares the onboard rows with the interpolated reference', () => {
    const bundle = makeSyntheticBundle({ seconds: 20, withPoses: true, particles: 100 });
    // The fixture's onboard estimate is 0.058 m off the truth: no flag.
    expect(detectOnboardDepartureFromReference(bundle)).toEqual([]);
    const onboard = bundle.onboard!;
    for (let k = 0; k < onboard.t.length; k++)
      if (onboard.t[k] >= 8 && onboard.t[k] < 12) onboard.y[k] += 0.8;
    const flags = detectOnboardDepartureFromReference(bundle);
    expect(flags).toHaveLength(1);
    expect(flags[0].kind).toBe('onboard_departed_from_reference');
    expect(flags[0].start).toBeCloseTo(8, 1);
    // Fixture offset (0.05, -0.03) plus 0.8 m in y: hypot(0.05, 0.77) = 0.772 m.
    expect(flags[0].evidence).toContain('max 0.77 m');
  });

  it('needs both tables', () => {
    const bundle = makeSyntheticBundle({ seconds: 5, withPoses: false, particles: 100 });
    expect(detectOnboardDepartureFromReference(bundle)).toEqual([]);
  });
});
