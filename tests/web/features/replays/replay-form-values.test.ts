import type { FilterConfig } from '@shared/bundle/types';
import { installPlainWords } from '@shared/contracts/plain-words';
import { describe, expect, it } from 'vitest';
import {
  defaultsFrom,
  limitHints,
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

describe('replay launcher limits from the bundle', () => {
  const defaults = defaultsFrom(FILTER);
  // A 271-beam scanner: 270° at 1° steps plus both ends (a common safety-scanner layout, from memory).
  const limits = { scanBeams: 271, maxParticles: 200_000 };

  it('refuses more beams than the scanner records, beside the field, naming the limit', () => {
    const request = toStartRequest({ ...defaults, beams_used: '9999' }, defaults, limits);
    expect(request.ok).toBe(false);
    if (request.ok) return;
    expect(request.issues['overrides.beams_used']).toMatch(/271 or less/);
  });

  it('accepts the scanner’s own beam count', () => {
    expect(toStartRequest({ ...defaults, beams_used: '271' }, defaults, limits).ok).toBe(true);
  });

  it('shows the limits in the hints', () => {
    const hints = limitHints(limits);
    expect(hints.beams_used).toContain('1–271');
    expect(hints.particles).toContain('200,000');
  });

  it('speaks plain words for a particle count out of range', () => {
    installPlainWords();
    const request = toStartRequest({ ...defaults, particles: '0' }, defaults, limits);
    if (request.ok) throw new Error('0 particles must be refused');
    expect(request.issues['overrides.particles']).toBe('This must be 1 or more');
  });
});
