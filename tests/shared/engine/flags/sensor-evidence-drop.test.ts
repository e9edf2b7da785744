import { describe, expect, it } from 'vitest';
import { measureEvidenceProfile } from '../../../../shared/engine/flags/evidence-profile';
import { detectSensorEvidenceDrop } from '../../../../shared/engine/flags/sensor-evidence-drop';
import { forEachStep, makeHealthySeries } from './synthetic-series';

const detect = (series: ReturnType<typeof makeHealthySeries>) =>
  detectSensorEvidenceDrop(series, measureEvidenceProfile(series));

describe('detectSensorEvidenceDrop', () => {
  it('stays quiet on a steady run with ordinary noise', () => {
    expect(detect(makeHealthySeries(60))).toEqual([]);
  });

  it('flags a sharp fall in log-likelihood per measurement, from its start', () => {
    const series = makeHealthySeries(60);
    forEachStep(30, 34, (k) => {
      series.log_likelihood[k] = series.measurements[k] * -2.5;
    });
    const flags = detect(series);
    expect(flags).toHaveLength(1);
    expect(flags[0].start).toBeCloseTo(30, 6);
    expect(flags[0].end).toBeCloseTo(33.9, 6);
    // Level about 1 nat, now -2.5: a drop of about 3.5 nats is strong evidence.
    expect(flags[0].severity).toBe('critical');
    expect(flags[0].evidence).toMatch(/fell by a median 3\.\d\d nats/);
  });

  it('keeps comparing with the level before a long fault (the fault does not become the new normal)', () => {
    const series = makeHealthySeries(60);
    forEachStep(20, 28, (k) => {
      series.log_likelihood[k] = series.measurements[k] * 0.2;
    });
    const flags = detect(series);
    expect(flags).toHaveLength(1);
    expect(flags[0].start).toBeCloseTo(20, 6);
    expect(flags[0].end).toBeGreaterThan(27.5);
    expect(flags[0].severity).toBe('warning');
  });

  it('flags losing most valid beams even when the few left still fit', () => {
    const series = makeHealthySeries(60);
    forEachStep(30, 33, (k) => {
      series.measurements[k] = 9;
      series.log_likelihood[k] = 9;
    });
    const flags = detect(series);
    expect(flags).toHaveLength(1);
    expect(flags[0].start).toBeCloseTo(30, 6);
    expect(flags[0].severity).toBe('critical');
    expect(flags[0].evidence).toContain('valid measurements fell as low as');
  });

  it('does not flag a drop shorter than the minimum duration', () => {
    const series = makeHealthySeries(60);
    forEachStep(30, 30.2, (k) => {
      series.log_likelihood[k] = -100;
    });
    expect(detect(series)).toEqual([]);
  });
});
