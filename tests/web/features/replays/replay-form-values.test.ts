import type { FilterConfig } from '@shared/bundle/types';
import { describe, expect, it } from 'vitest';
import {
  defaultsFrom,
  summarizeOverrides,
  toStartRequest,
} from '../../../../web/src/features/replays/components/replay-form-values';

const FILTER: FilterConfig = {
  particles: 1000,
  seed: 7,
  motion: { model: 'odometry', alpha: [0.05, 0.01, 0.05, 0.01] },
  scan_model: { model: 'likelihood_field', z_hit: 0.9, z_rand: 0.1, sigma_hit: 0.1, beams_used: 60 },
  resampling: { method: 'systematic', threshold: 0.5 },
  initial: { mode: 'global' },
};

describe('replay launcher values', () => {
  const defaults = defaultsFrom(FILTER);

  it('sends no overrides when nothing was changed, so the replay uses the manifest', () => {
    const request = toStartRequest(defaults, defaults);
    expect(request).toEqual({ ok: true, body: { label: undefined, overrides: {} } });
  });

  it('sends only the changed fields, as numbers', () => {
    const request = toStartRequest(
      { ...defaults, particles: '2000', recovery: true, motion_alpha: ['0.1', '0.01', '0.05', '0.01'] },
      defaults,
    );
    expect(request.ok && request.body.overrides).toEqual({
      particles: 2000,
      recovery: true,
      motion_alpha: [0.1, 0.01, 0.05, 0.01],
    });
  });

  it('reports what the shared schema refuses, keyed by field path', () => {
    const request = toStartRequest(
      { ...defaults, particles: 'many', resampling_threshold: '1.5', motion_alpha: ['0.1', '-1', '0', '0'] },
      defaults,
    );
    expect(request.ok).toBe(false);
    if (request.ok) return;
    expect(Object.keys(request.issues).sort()).toEqual([
      'overrides.motion_alpha.1',
      'overrides.particles',
      'overrides.resampling_threshold',
    ]);
  });

  it('summarises overrides in one line', () => {
    expect(summarizeOverrides({})).toBe('manifest settings');
    expect(summarizeOverrides({ particles: 2000, recovery: true })).toBe('particles 2000 · recovery on');
  });
});
