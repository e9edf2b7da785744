import type { TReplay, TReplayFlag } from '@shared/contracts/replays';
import { judgeFixOutcome, pickOriginalReplay } from '@shared/fixes/fix-outcome';
import { describe, expect, it } from 'vitest';

const replay = (patch: Partial<TReplay>): TReplay => ({
  id: 'r',
  bundleId: 'b1',
  caseId: 'c',
  label: '',
  status: 'done',
  overrides: {},
  settings: null,
  digest: 'd',
  engine: null,
  steps: 1,
  elapsedMs: 1,
  metrics: null,
  flags: [],
  error: null,
  progress: null,
  createdBy: { id: 'u', name: 'U' },
  createdAt: '2026-03-14T09:00:00Z',
  finishedAt: null,
  ...patch,
});

const flag = (severity: TReplayFlag['severity']): TReplayFlag => ({
  kind: 'belief_collapse',
  start: 1,
  end: 2,
  severity,
  evidence: 'ESS fell',
});

describe('the replay a fix is compared against', () => {
  it('is the earliest finished replay of the same bundle that ran without overrides', () => {
    const verification = replay({
      id: 'v',
      overrides: { particles: 800 },
      createdAt: '2026-03-14T12:00:00Z',
    });
    const tuned = replay({ id: 't', overrides: { particles: 300 }, createdAt: '2026-03-14T08:00:00Z' });
    const plain = replay({ id: 'p', createdAt: '2026-03-14T10:00:00Z' });
    const otherBundle = replay({ id: 'o', bundleId: 'b2', createdAt: '2026-03-14T07:00:00Z' });
    const failed = replay({ id: 'f', status: 'failed', createdAt: '2026-03-14T06:00:00Z' });
    expect(pickOriginalReplay([verification, tuned, plain, otherBundle, failed], verification)?.id).toBe('p');
    expect(pickOriginalReplay([verification, tuned], verification)?.id).toBe('t');
    expect(pickOriginalReplay([verification], verification)).toBeUndefined();
  });
});

// Expected outcomes are the rule written in issue #12 (point 6): improved means fewer critical
// flags, a divergence gone or later, or a lower RMSE against the reference.
describe('whether a verification replay improved on the original', () => {
  const original = replay({
    id: 'o',
    flags: [flag('critical'), flag('critical'), flag('warning')],
    metrics: { rmse_reference: 0.42, rmse_onboard: 0.3, diverged_at: 12.5 },
  });

  it('counts fewer critical flags as an improvement, not fewer warnings', () => {
    const fewerCritical = replay({ id: 'v', flags: [flag('critical')], metrics: original.metrics });
    expect(judgeFixOutcome(original, fewerCritical)).toEqual({
      kind: 'improved',
      improvements: ['critical flags went from 2 to 1'],
    });
    const fewerWarnings = replay({
      id: 'v',
      flags: [flag('critical'), flag('critical')],
      metrics: original.metrics,
    });
    expect(judgeFixOutcome(original, fewerWarnings).kind).toBe('not_improved');
  });

  it('counts a vanished or later divergence and a lower RMSE', () => {
    const noDivergence = replay({
      id: 'v',
      flags: original.flags,
      metrics: { rmse_reference: 0.42, rmse_onboard: 0.3, diverged_at: null },
    });
    expect(judgeFixOutcome(original, noDivergence)).toEqual({
      kind: 'improved',
      improvements: ['the replay no longer diverges from the reference'],
    });
    const later = replay({
      id: 'v',
      flags: original.flags,
      metrics: { rmse_reference: 0.05, rmse_onboard: 0.3, diverged_at: 20 },
    });
    expect(judgeFixOutcome(original, later)).toEqual({
      kind: 'improved',
      improvements: [
        'divergence from the reference moved from 12.5 s to 20.0 s',
        'RMSE against the reference went from 0.420 m to 0.050 m',
      ],
    });
  });

  it('warns when the same or worse, and when there is nothing to compare', () => {
    const same = replay({ id: 'v', flags: original.flags, metrics: original.metrics });
    expect(judgeFixOutcome(original, same)).toMatchObject({
      kind: 'not_improved',
      warning: expect.stringMatching(/did not improve/),
    });
    const worse = replay({
      id: 'v',
      flags: [...original.flags, flag('critical')],
      metrics: { rmse_reference: 0.9, rmse_onboard: 0.3, diverged_at: 3 },
    });
    expect(judgeFixOutcome(original, worse).kind).toBe('not_improved');
    expect(judgeFixOutcome(undefined, same).kind).toBe('no_comparison');
    expect(judgeFixOutcome(original, undefined).kind).toBe('no_comparison');
    expect(judgeFixOutcome(original, replay({ id: 'v', status: 'running' })).kind).toBe('no_comparison');
  });
});
