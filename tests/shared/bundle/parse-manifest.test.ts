import { describe, expect, it } from 'vitest';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import {
  expectIssue,
  fixtureManifest,
  fixtureMap,
  issuesWithFile,
  makeBundleFiles,
  withFile,
} from '../../support/bundle-fixtures';

// biome-ignore lint/suspicious/noExplicitAny: the tests edit arbitrary, deliberately wrong JSON
type LooseJson = Record<string, any>;

function manifestWith(change: (manifest: LooseJson) => void): string {
  const manifest = fixtureManifest() as LooseJson;
  change(manifest);
  return JSON.stringify(manifest);
}

describe('manifest.json', () => {
  // A confusion matrix is row-stochastic: each row is a probability distribution over reported classes.
  it('rejects a confusion row that does not sum to 1 within 1e-6, naming the row', () => {
    const text = manifestWith((m) => {
      m.detector.confusion[1] = [0.1, 0.8, 0.05];
    });
    const issues = issuesWithFile('manifest.json', text);
    expectIssue(issues, { file: 'manifest.json', field: 'detector.confusion[1]' }, /does not sum to 1/);
    expect(Number(issues[0].found)).toBeCloseTo(0.95, 12);
  });

  it('accepts a row that misses 1 by less than 1e-6', () => {
    const text = manifestWith((m) => {
      m.detector.confusion[0] = [0.9, 0.05, 0.0500005];
    });
    expect(issuesWithFile('manifest.json', text)).toEqual([]);
  });

  it('requires a square confusion matrix of classes.length', () => {
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((m) => {
        m.detector.confusion = [
          [0.5, 0.5],
          [0.5, 0.5],
        ];
      }),
    );
    expectIssue(
      issues,
      { field: 'detector.confusion', expected: '3 rows', found: '2 rows' },
      /one row per class/,
    );
    expectIssue(issues, { field: 'detector.confusion[0]', expected: '3 entries' }, /one entry per class/);
  });

  it('names the JSON path, expected type and found value for a wrong type', () => {
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((m) => (m.filter.particles = 'many')),
    );
    expectIssue(
      issues,
      { file: 'manifest.json', field: 'filter.particles', expected: 'number', found: '"\\"many\\""' },
      /expected number/i,
    );
  });

  it('rejects scan.beams of 0', () => {
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((m) => (m.scan.beams = 0)),
    );
    expectIssue(issues, { field: 'scan.beams' }, /0/);
  });

  it('reports a missing required field and a misspelt optional block', () => {
    const issues = issuesWithFile(
      'manifest.json',
      manifestWith((m) => {
        delete m.robot.footprint;
        m.filter.recovry = { enabled: true };
      }),
    );
    expectIssue(issues, { field: 'robot.footprint', found: 'missing' }, /./);
    expectIssue(issues, { field: 'filter' }, /unknown field\(s\): recovry/);
  });

  it('accepts the optional recovery and KLD blocks and checks their ordering', () => {
    const good = manifestWith((m) => {
      m.filter.recovery = { enabled: true, alpha_slow: 0.001, alpha_fast: 0.1 };
      m.filter.kld = {
        enabled: true,
        epsilon: 0.05,
        delta: 0.01,
        bin_size: [0.2, 0.2, 0.1],
        min_particles: 100,
        max_particles: 5000,
      };
    });
    expect(issuesWithFile('manifest.json', good)).toEqual([]);
    const bad = manifestWith((m) => {
      m.filter.recovery = { enabled: true, alpha_slow: 0.2, alpha_fast: 0.1 };
      m.filter.kld = {
        enabled: true,
        epsilon: 0.05,
        delta: 0.01,
        bin_size: [0.2, 0.2, 0.1],
        min_particles: 900,
        max_particles: 500,
      };
    });
    const issues = issuesWithFile('manifest.json', bad);
    expectIssue(issues, { field: 'filter.recovery.alpha_slow' }, /smaller than alpha_fast/);
    expectIssue(issues, { field: 'filter.kld.min_particles' }, /must not exceed/);
  });

  it('requires a grid for global initialisation', () => {
    const globalMode = manifestWith((m) => (m.filter.initial = { mode: 'global' }));
    expect(issuesWithFile('manifest.json', globalMode)).toEqual([]);
    const landmarkOnlyMap = { ...fixtureMap(), rows: undefined };
    const files = withFile(makeBundleFiles(), 'map.json', JSON.stringify(landmarkOnlyMap));
    expect(validateBundleFiles(files).issues).toEqual([]);
    const issues = validateBundleFiles(withFile(files, 'manifest.json', globalMode)).issues;
    expectIssue(issues, { file: 'manifest.json', field: 'filter.initial.mode' }, /no rows/);
  });

  it('reports a JSON syntax error with its line', () => {
    const issues = issuesWithFile('manifest.json', '{\n  "format": "incident-bundle/1",\n  "robot": }\n');
    expectIssue(issues, { file: 'manifest.json', line: 3 }, /not valid JSON/);
  });

  it('reports a missing required file', () => {
    expectIssue(
      issuesWithFile('manifest.json', undefined),
      { file: 'manifest.json' },
      /required file is missing/,
    );
    expectIssue(
      issuesWithFile('odometry.csv', undefined),
      { file: 'odometry.csv' },
      /required file is missing/,
    );
  });
});
