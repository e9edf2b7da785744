import { createHash } from 'node:crypto';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { inspectBundle } from '../../../api/src/bundles/inspect-bundle';
import { findBundleRoot } from '../../../api/src/bundles/zip-files';
import { validateBundleFiles } from '../../../shared/bundle/validate-bundle-files';
import {
  makeBundleFiles,
  makeTempDir,
  withFile,
  writeBundleFolder,
  writeBundleZip,
} from '../../support/bundle-fixtures';

const sha256 = (text: string | Buffer) => createHash('sha256').update(text).digest('hex');

describe('inspectBundle', () => {
  it('reads a folder and hashes every file as Node crypto does', async () => {
    const files = makeBundleFiles({ steps: 50 });
    const dir = await writeBundleFolder(join(await makeTempDir(), 'bundle'), files);
    const inspection = await inspectBundle({ kind: 'folder', path: dir });
    expect(inspection.issues).toEqual([]);
    expect(inspection.ok).toBe(true);
    const expected = Object.entries(files).map(([name, text]) => ({
      name,
      size: Buffer.byteLength(text),
      sha256: sha256(text),
    }));
    expect(inspection.files).toEqual(expect.arrayContaining(expected));
    expect(inspection.files).toHaveLength(expected.length);
    expect(inspection.summary?.rows.odometry).toBe(50);
  });

  it('gives the same bundle from a zip as the pure reader gives from strings', async () => {
    const files = makeBundleFiles({ steps: 40, beams: 11 });
    const path = await writeBundleZip(join(await makeTempDir(), 'b.zip'), files);
    const inspection = await inspectBundle({ kind: 'zip', path });
    const reference = validateBundleFiles(files);
    if (!reference.ok || !inspection.bundle) throw new Error('both should be valid');
    expect(inspection.bundle.scans?.ranges).toEqual(reference.bundle.scans?.ranges);
    expect(inspection.bundle.events).toEqual(reference.bundle.events);
    expect(inspection.bundle.odometry).toEqual(reference.bundle.odometry);
  });

  it('accepts a zip whose files sit in one top-level folder, and keeps unknown files as warnings', async () => {
    const files = { ...makeBundleFiles(), 'photo-of-aisle.jpg': Buffer.from([0xff, 0xd8, 0xff]) };
    const path = await writeBundleZip(join(await makeTempDir(), 'b.zip'), files, {
      topFolder: 'incident-2026-11-14',
    });
    const inspection = await inspectBundle({ kind: 'zip', path });
    expect(inspection.ok).toBe(true);
    expect(inspection.issues).toEqual([
      expect.objectContaining({ file: 'incident-2026-11-14/photo-of-aisle.jpg', severity: 'warning' }),
    ]);
    expect(inspection.files.map((file) => file.name)).toContain('incident-2026-11-14/odometry.csv');
  });

  it('finds the bundle root: the zip root, or its single top-level folder', () => {
    expect(findBundleRoot(['manifest.json', 'odometry.csv'])).toBe('');
    expect(findBundleRoot(['b/', 'b/manifest.json', 'b/map.json', '__MACOSX/b/._map.json'])).toBe('b/');
    expect(findBundleRoot(['a/manifest.json', 'c/map.json'])).toBe('');
  });

  it('reports table errors found while streaming a zip, with line and field', async () => {
    const files = withFile(makeBundleFiles(), 'odometry.csv', 't,x,y,theta\n0,0,0,0\n0.1,0,0,9\n');
    const path = await writeBundleZip(join(await makeTempDir(), 'b.zip'), files);
    const inspection = await inspectBundle({ kind: 'zip', path });
    expect(inspection.ok).toBe(false);
    expect(inspection.issues).toEqual([
      expect.objectContaining({ file: 'odometry.csv', line: 3, field: 'theta' }),
    ]);
    expect(inspection.files).toHaveLength(Object.keys(files).length); // still hashed as evidence
  });

  it('reports a file that is not UTF-8 text', async () => {
    const dir = await writeBundleFolder(join(await makeTempDir(), 'b'), {
      ...makeBundleFiles(),
      'commands.csv': Buffer.from([0x74, 0x2c, 0xff, 0xfe, 0x0a]),
    });
    const inspection = await inspectBundle({ kind: 'folder', path: dir });
    expect(inspection.issues).toContainEqual(
      expect.objectContaining({ file: 'commands.csv', message: 'not valid UTF-8 text' }),
    );
  });

  it('reports a path that does not exist', async () => {
    const inspection = await inspectBundle({ kind: 'folder', path: join(await makeTempDir(), 'missing') });
    expect(inspection.issues).toEqual([
      expect.objectContaining({ file: 'missing', message: 'no such file or folder' }),
    ]);
  });
});
