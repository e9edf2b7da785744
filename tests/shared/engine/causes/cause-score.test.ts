/**
 * Confidence rule of docs/causes.md (the issue's own requirement, not a value from the code):
 * a cause without a supporting counterfactual stays below 0.5 whatever its evidence, one with
 * support reaches 0.5, stronger evidence never lowers confidence, and a cause explained away by
 * a much better counterfactual loses its support.
 */
import { describe, expect, it } from 'vitest';
import { type ScoredCause, scoreCause } from '../../../../shared/engine/causes/cause-score';
import type { CounterfactualRun } from '../../../../shared/engine/causes/cause-types';
import { explainAway } from '../../../../shared/engine/causes/explain-away';

const run = (supports: boolean): CounterfactualRun => ({
  label: 'test',
  settings: { span: { start: 0, end: 1 }, replay: {} as CounterfactualRun['settings']['replay'] },
  digest: 'x',
  metric: 'nats',
  value: 1,
  supports,
});
const cause = (over: Partial<ScoredCause>): ScoredCause => ({
  kind: 'odometry_fault',
  start: 10,
  end: 12,
  strength: 1,
  evidence: 'e',
  against: '',
  counterfactuals: [run(true)],
  gain: 1,
  ...over,
});

describe('scoreCause', () => {
  it.each([0, 0.3, 1, 5, Number.NaN])('keeps an unsupported cause below 0.5 at strength %s', (strength) => {
    const scored = scoreCause(cause({ strength, counterfactuals: [run(false)] }));
    expect(scored.confidence).toBeLessThan(0.5);
    expect(scored.confidence).toBeGreaterThanOrEqual(0);
  });

  it('puts a supported cause at 0.5 or more, never above 1, and rising with its evidence', () => {
    const weak = scoreCause(cause({ strength: 0 })).confidence;
    const strong = scoreCause(cause({ strength: 1 })).confidence;
    expect(weak).toBeGreaterThanOrEqual(0.5);
    expect(strong).toBeLessThanOrEqual(1);
    expect(strong).toBeGreaterThan(weak);
  });
});

describe('explainAway', () => {
  it('takes the support from an overlapping cause whose counterfactual gained far less, and says why', () => {
    const [weaker, stronger] = explainAway([
      cause({ kind: 'sensor_degraded', gain: 0.4 }),
      cause({ kind: 'external_displacement', gain: 3 }),
    ]).map(scoreCause);
    expect(weaker.confidence).toBeLessThan(0.5);
    expect(weaker.against).toMatch(/explains the same interval better/);
    expect(stronger.confidence).toBeGreaterThanOrEqual(0.5);
  });

  it('leaves causes alone that do not overlap in time', () => {
    const scored = explainAway([
      cause({ kind: 'sensor_degraded', gain: 0.4, start: 0, end: 5 }),
      cause({ kind: 'external_displacement', gain: 3, start: 8, end: 9 }),
    ]).map(scoreCause);
    expect(scored.every((c) => c.confidence >= 0.5)).toBe(true);
  });
});
