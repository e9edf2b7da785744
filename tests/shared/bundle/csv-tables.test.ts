import { describe, expect, it } from 'vitest';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import { expectIssue, issuesWithFile, makeBundleFiles, withFile } from '../../support/bundle-fixtures';

const issuesWith = (name: string, content: string) => issuesWithFile(name, content);

describe('CSV tables of a bundle', () => {
  it('names file, line and field for a non-number (CSV header = line 1)', () => {
    const issues = issuesWith('odometry.csv', 't,x,y,theta\n0,1,2,0\n0.1,1,two,0\n');
    expectIssue(issues, { file: 'odometry.csv', line: 3, field: 'y', found: '"two"' }, /not a number/);
  });

  it('reports a row with the wrong column count with expected and found counts', () => {
    const issues = issuesWith('commands.csv', 't,v,omega\n0,0.5,0.1\n0.1,0.5\n');
    expectIssue(
      issues,
      { file: 'commands.csv', line: 3, expected: '3 (t,v,omega)', found: '2' },
      /wrong column count/,
    );
  });

  it('rejects NaN and infinite values', () => {
    const issues = issuesWith('odometry.csv', 't,x,y,theta\n0,NaN,0,0\n0.1,0,Infinity,0\n');
    expectIssue(issues, { line: 2, field: 'x' }, /NaN or infinite/);
    expectIssue(issues, { line: 3, field: 'y' }, /NaN or infinite/);
  });

  it.each([
    ['odometry.csv', 't,x,y,theta\n0,0,0,0\n0.2,0,0,0\n0.2,0,0,0\n'],
    ['reference_pose.csv', 't,x,y,theta,source\n0,0,0,0,survey\n0.2,0,0,0,survey\n0.1,0,0,0,survey\n'],
    ['commands.csv', 't,v,omega\n0,0,0\n0.2,0,0\n0.2,0,0\n'],
    ['onboard_pose.csv', 't,x,y,theta\n0,0,0,0\n0.2,0,0,0\n0.2,0,0,0\n'],
  ])('requires t strictly increasing in %s', (file, content) => {
    expectIssue(issuesWith(file, content), { file, line: 4, field: 't' }, /not strictly increasing/);
  });

  it('lets detections of one frame share a t but not go backwards', () => {
    const content = 't,class,range,bearing\n0.2,dock,1,0\n0.2,reflector,2,0.5\n0.1,column,3,0\n';
    const issues = issuesWith('detections.csv', content).filter((issue) => issue.file === 'detections.csv');
    expect(issues).toHaveLength(1);
    expectIssue(issues, { file: 'detections.csv', line: 4, field: 't' }, /goes backwards in time/);
  });

  it('lets events repeat a t but not go backwards', () => {
    const content = 't,kind,detail\n1,contact,a\n1,protective_stop,b\n0.5,operator_note,c\n';
    const issues = issuesWith('events.csv', content);
    expect(issues.filter((issue) => issue.file === 'events.csv')).toHaveLength(1);
    expectIssue(issues, { file: 'events.csv', line: 4, field: 't' }, /goes backwards in time/);
  });

  it('rejects a negative t', () => {
    expectIssue(issuesWith('odometry.csv', 't,x,y,theta\n-0.1,0,0,0\n'), { line: 2, field: 't' }, /negative/);
  });

  it('rejects an angle outside (-pi, pi]', () => {
    const issues = issuesWith('odometry.csv', 't,x,y,theta\n0,0,0,3.5\n0.1,0,0,-3.141592653589793\n');
    expectIssue(issues, { line: 2, field: 'theta' }, /outside \(-pi, pi\]/);
    expectIssue(issues, { line: 3, field: 'theta' }, /outside \(-pi, pi\]/);
  });

  it('names an unknown detection class and lists the known ones', () => {
    const issues = issuesWith('detections.csv', 't,class,range,bearing\n0.1,pallet,2,0.1\n');
    expectIssue(
      issues,
      { file: 'detections.csv', line: 2, field: 'class', found: '"pallet"' },
      /unknown class/,
    );
    expect(issues[0].expected).toBe('one of reflector, dock, column');
  });

  it('rejects a header that does not match the format, on line 1', () => {
    const issues = issuesWith('odometry.csv', 'time,x,y,yaw\n0,0,0,0\n');
    expectIssue(
      issues,
      { file: 'odometry.csv', line: 1, field: 'header', expected: 't,x,y,theta' },
      /header/,
    );
  });

  it('accepts CRLF line endings, a trailing empty line and quoted commas in events', () => {
    const files = makeBundleFiles();
    const crlf = withFile(files, 'odometry.csv', files['odometry.csv'].replaceAll('\n', '\r\n'));
    const result = validateBundleFiles(
      withFile(crlf, 'events.csv', 't,kind,detail\r\n0.5,contact,"left, rear"\r\n\r\n'),
    );
    expect(result.issues).toEqual([]);
    expect(result.ok && result.bundle.events?.detail).toEqual(['left, rear']);
    expect(result.ok && result.bundle.odometry.t.length).toBe(20);
  });

  it('reports an empty line in the middle of a table', () => {
    expectIssue(
      issuesWith('commands.csv', 't,v,omega\n0,0,0\n\n0.1,0,0\n'),
      { file: 'commands.csv', line: 3 },
      /empty line/,
    );
  });

  it('reads the optional covariance columns of onboard_pose.csv', () => {
    const result = validateBundleFiles(makeBundleFiles());
    expect(result.ok && result.bundle.onboard?.cov?.tt[0]).toBe(0.0025);
  });

  it('reports an empty required table and a header-only odometry', () => {
    expectIssue(issuesWith('odometry.csv', ''), { file: 'odometry.csv', line: 1 }, /empty/);
    expectIssue(issuesWith('odometry.csv', 't,x,y,theta\n'), { file: 'odometry.csv' }, /no data rows/);
  });
});
