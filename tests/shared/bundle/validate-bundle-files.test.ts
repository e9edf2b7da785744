import { describe, expect, it } from 'vitest';
import { formatIssue } from '../../../shared/bundle/format-issue';
import { MAX_REPORTED_ISSUES } from '../../../shared/bundle/issue-collector';
import { summarizeBundle } from '../../../shared/bundle/summarize-bundle';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import { makeBundleFiles, withFile } from '../../support/bundle-fixtures';

/** Data rows of a CSV text, counted independently of the reader: non-empty lines after the header. */
const dataRows = (text: string) => text.split('\n').filter((line) => line.trim() !== '').length - 1;

describe('validateBundleFiles', () => {
  it('reads a valid bundle with every table', () => {
    const files = makeBundleFiles({ steps: 37, beams: 9 });
    const result = validateBundleFiles(files);
    expect(result.issues).toEqual([]);
    expect(result.ok).toBe(true);
    if (!result.ok) return;
    const { bundle } = result;
    expect(bundle.odometry.t.length).toBe(dataRows(files['odometry.csv']));
    expect(bundle.scans?.ranges.length).toBe(37 * 9);
    expect(bundle.detections?.classIndex[1]).toBe(1); // 'dock' is classes[1]
    expect(bundle.reference?.source[0]).toBe('site camera survey');
  });

  it('summarises row counts, time span, sensors and events', () => {
    const files = makeBundleFiles({ steps: 25 });
    const result = validateBundleFiles(files);
    if (!result.ok) throw new Error('fixture should be valid');
    const summary = summarizeBundle(result.bundle);
    expect(summary.rows).toEqual({
      odometry: dataRows(files['odometry.csv']),
      scans: files['scans.ndjson'].trim().split('\n').length,
      detections: dataRows(files['detections.csv']),
      onboard_pose: dataRows(files['onboard_pose.csv']),
      events: dataRows(files['events.csv']),
      commands: dataRows(files['commands.csv']),
      reference_pose: dataRows(files['reference_pose.csv']),
    });
    // 25 rows at 10 Hz from t = 0: the last is at 2.4 s.
    expect(summary.timeSpan).toEqual({ start: 0, end: 2.4 });
    expect(summary.durationSeconds).toBeCloseTo(2.4, 12);
    expect(summary.sensors).toEqual(['odometry', 'laser', 'landmark_detector']);
    expect(summary.eventCounts).toEqual({ warning_field: 1, operator_note: 1, contact: 1 });
  });

  it('keeps an unknown extra file as a warning without failing the bundle', () => {
    const result = validateBundleFiles({ ...makeBundleFiles(), 'notes.txt': 'shift log' });
    expect(result.ok).toBe(true);
    expect(result.issues).toEqual([expect.objectContaining({ file: 'notes.txt', severity: 'warning' })]);
  });

  it(`collects every error up to ${MAX_REPORTED_ISSUES}, then one "...and N more"`, () => {
    const rows = Array.from({ length: 300 }, (_, k) => `${k * 0.1},bad,0,0`);
    const result = validateBundleFiles(
      withFile(makeBundleFiles(), 'odometry.csv', `t,x,y,theta\n${rows.join('\n')}\n`),
    );
    expect(result.ok).toBe(false);
    expect(result.issues).toHaveLength(MAX_REPORTED_ISSUES + 1);
    expect(result.issues[0]).toMatchObject({ file: 'odometry.csv', line: 2, field: 'x' });
    expect(result.issues[MAX_REPORTED_ISSUES - 1].line).toBe(MAX_REPORTED_ISSUES + 1);
    expect(result.issues[MAX_REPORTED_ISSUES].message).toMatch(/^\.\.\.and 100 more/);
  });

  it('formats issues as file:line: field: message', () => {
    const result = validateBundleFiles(withFile(makeBundleFiles(), 'commands.csv', 't,v,omega\n0,fast,0\n'));
    expect(result.issues.map(formatIssue)).toEqual([
      'commands.csv:2: v: not a number (expected a finite decimal number, found "fast")',
    ]);
    expect(formatIssue({ file: 'manifest.json', message: 'required file is missing' })).toBe(
      'manifest.json: required file is missing',
    );
  });
});
