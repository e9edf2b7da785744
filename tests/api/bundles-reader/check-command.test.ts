import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { run } from '../../../api/src/cli/commands/check';
import {
  makeBundleFiles,
  makeTempDir,
  withFile,
  writeBundleFolder,
  writeBundleZip,
} from '../../support/bundle-fixtures';

/** Runs the command with stdout and stderr captured. */
async function check(args: string[]) {
  let stdout = '';
  let stderr = '';
  vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => {
    stdout += String(chunk);
    return true;
  });
  vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => {
    stderr += String(chunk);
    return true;
  });
  const code = await run(args);
  vi.restoreAllMocks();
  return { code, stdout, stderr };
}

afterEach(() => vi.restoreAllMocks());

describe('cli check', () => {
  it('exits 0 with a report of files, rows, span and sensors for a valid folder', async () => {
    const dir = await writeBundleFolder(join(await makeTempDir(), 'b'), makeBundleFiles({ steps: 12 }));
    const { code, stdout, stderr } = await check([dir]);
    expect(code).toBe(0);
    expect(stderr).toBe('');
    expect(stdout).toMatch(/Status: VALID/);
    expect(stdout).toMatch(/odometry\s+12/);
    // Odometry ends at 1.1 s, but the fixture's last event (contact) is at 1.2 s.
    expect(stdout).toMatch(/Time span: 0\.000 s to 1\.200 s/);
    expect(stdout).toMatch(/Sensors: odometry, laser, landmark_detector/);
    expect(stdout).toMatch(/[0-9a-f]{64} {2}odometry\.csv/);
  });

  it('exits 2 with one file:line: field: message per error on stderr', async () => {
    const files = withFile(makeBundleFiles(), 'commands.csv', 't,v,omega\n0,0,0\n0.1,x,0\n0.05,0,0\n');
    const path = await writeBundleZip(join(await makeTempDir(), 'b.zip'), files);
    const { code, stderr } = await check([path]);
    expect(code).toBe(2);
    expect(stderr.trim().split('\n')).toEqual([
      'commands.csv:3: v: not a number (expected a finite decimal number, found "x")',
      'commands.csv:4: t: t is not strictly increasing (expected > 0.1, found 0.05)',
    ]);
  });

  it('prints the inspection as JSON with --json and keeps the exit code', async () => {
    const path = join(await makeTempDir(), 'broken.zip');
    await writeFile(path, 'not a zip');
    const { code, stdout } = await check([path, '--json']);
    expect(code).toBe(2);
    const parsed = JSON.parse(stdout);
    expect(parsed).toMatchObject({
      ok: false,
      files: [],
      issues: [{ file: 'broken.zip', message: 'not a zip file' }],
    });
    expect(parsed.bundle).toBeUndefined();
  });

  it('exits 2 on bad usage', async () => {
    expect((await check([])).code).toBe(2);
    expect((await check(['a', 'b'])).code).toBe(2);
    const unknown = await check(['a', '--yaml']);
    expect(unknown.code).toBe(2);
    expect(unknown.stderr).toMatch(/Unknown option --yaml/);
  });
});
