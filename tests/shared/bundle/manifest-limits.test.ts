import { describe, expect, it } from 'vitest';
import { ZReplayOverrides } from '../../../shared/engine/settings';
import { expectIssue, fixtureManifest, issuesWithFile } from '../../support/bundle-fixtures';

// biome-ignore lint/suspicious/noExplicitAny: the tests edit arbitrary, deliberately wrong JSON
type LooseJson = Record<string, any>;

function manifestWith(change: (filter: LooseJson) => void): string {
  const manifest = fixtureManifest() as LooseJson;
  change(manifest.filter);
  return JSON.stringify(manifest);
}

// The particle limit is stated once: an override refused by the API must not be accepted when it
// arrives in a manifest instead (10^12 particles would need terabytes of memory).
describe('manifest filter limits equal the override limits', () => {
  it('refuses 10^12 particles, naming the field', () => {
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((f) => (f.particles = 1e12)),
    );
    expectIssue(issues, { file: 'manifest.json', field: 'filter.particles' }, /200000|200,000/);
    expect(ZReplayOverrides.safeParse({ particles: 1e12 }).success).toBe(false);
  });

  it('accepts exactly the largest particle count an override accepts, and refuses one more', () => {
    for (const particles of [200_000, 200_001]) {
      const asOverride = ZReplayOverrides.safeParse({ particles }).success;
      const asManifest = issuesWithFile(
        'manifest.json',
        manifestWith((f) => (f.particles = particles)),
      );
      expect(asManifest.length === 0, String(particles)).toBe(asOverride);
    }
  });

  it('applies the same limit to the KLD minimum and maximum', () => {
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((f) => {
        f.kld = {
          enabled: true,
          epsilon: 0.05,
          delta: 0.01,
          bin_size: [0.5, 0.5, 0.2],
          min_particles: 100,
          max_particles: 5e7,
        };
      }),
    );
    expectIssue(issues, { file: 'manifest.json', field: 'filter.kld.max_particles' }, /200000|200,000/);
  });

  it('refuses a negative seed as an override refuses it', () => {
    expect(ZReplayOverrides.safeParse({ seed: -1 }).success).toBe(false);
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((f) => (f.seed = -1)),
    );
    expectIssue(issues, { file: 'manifest.json', field: 'filter.seed' }, /./);
  });
});
