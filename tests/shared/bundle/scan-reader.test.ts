import { describe, expect, it } from 'vitest';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import {
  expectIssue,
  fixtureManifest,
  issuesWithFile,
  makeBundleFiles,
  withFile,
} from '../../support/bundle-fixtures';

describe('scans.ndjson', () => {
  it('stores null ranges as NaN and keeps scan-major order', () => {
    const files = withFile(
      makeBundleFiles({ beams: 3 }),
      'scans.ndjson',
      '{"t":0,"ranges":[1.5,null,2]}\n{"t":0.1,"ranges":[3,4,5]}\n',
    );
    const result = validateBundleFiles(files);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { scans } = result.bundle;
    expect(scans?.count).toBe(2);
    expect(Array.from(scans!.ranges)).toEqual([1.5, Number.NaN, 2, 3, 4, 5]);
  });

  it('rejects a scan whose number of ranges differs from manifest.scan.beams', () => {
    const issues = issuesWithFile(
      'scans.ndjson',
      '{"t":0,"ranges":[1,1,1,1,1]}\n{"t":0.1,"ranges":[1,1,1]}\n',
    );
    expectIssue(
      issues,
      { file: 'scans.ndjson', line: 2, field: 'ranges', expected: '5', found: '3' },
      /wrong number of ranges/,
    );
  });

  it('rejects a negative range with its beam index', () => {
    const issues = issuesWithFile('scans.ndjson', '{"t":0,"ranges":[1,1,-0.5,1,1]}\n');
    expectIssue(issues, { file: 'scans.ndjson', line: 1, field: 'ranges[2]' }, /negative/);
  });

  it('requires t strictly increasing and not negative', () => {
    const scan = (t: number) => `{"t":${t},"ranges":[1,1,1,1,1]}`;
    const issues = issuesWithFile('scans.ndjson', [scan(-1), scan(0.5), scan(0.5)].join('\n'));
    expectIssue(issues, { line: 1, field: 't' }, /negative/);
    expectIssue(issues, { line: 3, field: 't', expected: '> 0.5' }, /not strictly increasing/);
  });

  it('reports a line that is not JSON', () => {
    expectIssue(
      issuesWithFile('scans.ndjson', '{"t":0,"ranges":[1,1,1,1,1]}\n{"t":0.1,'),
      { line: 2 },
      /not valid JSON/,
    );
  });

  it('reports scans when the manifest has no scan block', () => {
    const manifest = fixtureManifest();
    delete manifest.scan;
    const issues = issuesWithFile('manifest.json', JSON.stringify(manifest));
    expectIssue(issues, { file: 'manifest.json', field: 'scan' }, /no scan block/);
  });

  it('reports detections when the manifest has no detector block', () => {
    const manifest = fixtureManifest();
    delete manifest.detector;
    const issues = issuesWithFile('manifest.json', JSON.stringify(manifest));
    expectIssue(issues, { file: 'manifest.json', field: 'detector' }, /no detector block/);
  });
});
