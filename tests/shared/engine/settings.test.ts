import { describe, expect, it } from 'vitest';
import { parseReplayOverrides, resolveReplaySettings } from '../../../shared/engine/settings';
import { makeSyntheticBundle } from '../../support/engine-fixtures';

const manifest = makeSyntheticBundle({ seconds: 1 }).manifest;

describe('replay settings', () => {
  it('takes the manifest filter block and applies overrides', () => {
    const parsed = parseReplayOverrides({
      particles: 300,
      seed: 99,
      resampling_method: 'residual',
      resampling_threshold: 0.3,
      beams_used: 30,
      recovery: true,
    });
    expect(parsed.ok).toBe(true);
    const resolved = resolveReplaySettings(manifest, parsed.ok ? parsed.overrides : {});
    if (!resolved.ok) throw new Error('expected valid settings');
    expect(resolved.settings.particles).toBe(300);
    expect(resolved.settings.seed).toBe(99);
    expect(resolved.settings.resampling).toEqual({ method: 'residual', threshold: 0.3 });
    expect(resolved.settings.scan_model?.beams_used).toBe(30);
    expect(resolved.settings.recovery.enabled).toBe(true);
    expect(resolved.settings.motion.alpha).toEqual(manifest.filter.motion.alpha);
  });

  it('names the field of each bad override', () => {
    const parsed = parseReplayOverrides({
      particles: -5,
      resampling_method: 'fancy',
      resampling_threshold: 2,
      bogus: 1,
    });
    expect(parsed.ok).toBe(false);
    const fields = parsed.ok ? [] : parsed.issues.map((issue) => issue.field);
    expect(fields).toEqual(
      expect.arrayContaining(['particles', 'resampling_method', 'resampling_threshold', 'bogus']),
    );
  });

  it('refuses more beams than the scan has, naming beams_used', () => {
    const resolved = resolveReplaySettings(manifest, { beams_used: 500 });
    expect(resolved.ok).toBe(false);
    if (!resolved.ok) {
      expect(resolved.issues[0].field).toBe('beams_used');
      expect(resolved.issues[0].message).toContain('271');
    }
  });
});
