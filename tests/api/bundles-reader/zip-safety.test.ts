import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { crc32, createDeflateRaw } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { inspectBundle } from '../../../api/src/bundles/inspect-bundle';
import { findUnsafeEntryPath } from '../../../api/src/bundles/zip-entry-path';
import { makeBundleFiles, makeTempDir, writeBundleZip } from '../../support/bundle-fixtures';
import { buildRawZip, type RawZipEntry } from '../../support/raw-zip';

async function inspectZipBytes(bytes: Buffer, limits = {}) {
  const path = join(await makeTempDir(), 'upload.zip');
  await writeFile(path, bytes);
  return inspectBundle({ kind: 'zip', path }, limits);
}

const bundleEntries = (): RawZipEntry[] =>
  Object.entries(makeBundleFiles()).map(([name, text]) => ({ name, data: Buffer.from(text) }));

describe('zip entry paths', () => {
  // Zip Slip (Snyk, 2018): names that resolve outside the extraction folder.
  it.each([
    ['../x', /leaves the bundle root/],
    ['logs/../../x', /leaves the bundle root/],
    ['/etc/passwd', /absolute path/],
    ['..\\x', /backslash/],
    ['C:/Windows/x', /drive letter/],
  ])('refuses %s before unpacking anything', async (name, reason) => {
    const inspection = await inspectZipBytes(
      buildRawZip([...bundleEntries(), { name, data: Buffer.from('payload') }]),
    );
    expect(inspection.ok).toBe(false);
    expect(inspection.files).toEqual([]);
    expect(inspection.issues).toEqual([
      expect.objectContaining({ file: name, message: expect.stringMatching(reason) }),
    ]);
  });

  it('accepts ordinary nested names', () => {
    expect(findUnsafeEntryPath('incident-7/odometry.csv')).toBeUndefined();
    expect(findUnsafeEntryPath('a..b/c')).toBeUndefined();
  });
});

/** Deflates `size` zero bytes without ever holding them: the packed form of a classic zip bomb. */
async function deflateZeros(size: number): Promise<{ packed: Buffer; crc: number }> {
  const deflate = createDeflateRaw({ level: 9 });
  const parts: Buffer[] = [];
  deflate.on('data', (part: Buffer) => parts.push(part));
  const done = new Promise((resolve) => deflate.on('end', resolve));
  const chunk = Buffer.alloc(1024 * 1024);
  let crc = 0;
  for (let written = 0; written < size; written += chunk.length) {
    crc = crc32(chunk, crc);
    if (!deflate.write(chunk)) await new Promise((resolve) => deflate.once('drain', resolve));
  }
  deflate.end();
  await done;
  return { packed: Buffer.concat(parts), crc };
}

describe('zip bombs', () => {
  it('refuses an entry of 200 MB packed about 1000:1 from the directory alone', async () => {
    const size = 200 * 1024 * 1024;
    const { packed, crc } = await deflateZeros(size);
    expect(packed.length).toBeLessThan(size / 500);
    const bomb = buildRawZip([
      ...bundleEntries(),
      { name: 'odometry-extra.csv', data: Buffer.alloc(0), packed, crc, declaredSize: size },
    ]);
    const inspection = await inspectZipBytes(bomb);
    expect(inspection.ok).toBe(false);
    expect(inspection.files).toEqual([]); // nothing was inflated
    expect(inspection.issues[0]).toMatchObject({
      file: 'odometry-extra.csv',
      message: expect.stringMatching(/zip bomb/),
    });
  });

  it('refuses a zip whose total unpacked size passes the configured limit', async () => {
    const inspection = await inspectZipBytes(buildRawZip(bundleEntries()), { maxTotalBytes: 1000 });
    expect(inspection.ok).toBe(false);
    expect(inspection.issues).toEqual([
      expect.objectContaining({ file: 'upload.zip', message: expect.stringMatching(/total unpacked size/) }),
    ]);
  });

  it('stops inflating an entry whose directory lies about its size', async () => {
    const { packed, crc } = await deflateZeros(10 * 1024 * 1024);
    const liar = buildRawZip([
      { name: 'manifest.json', data: Buffer.alloc(0), packed, crc, declaredSize: 1000 },
      ...bundleEntries().slice(1),
    ]);
    const inspection = await inspectZipBytes(liar);
    expect(inspection.ok).toBe(false);
    expect(inspection.issues[0]).toMatchObject({
      file: 'manifest.json',
      message: expect.stringMatching(/more than the 1000 bytes/),
    });
    expect(inspection.files).toEqual([]);
  });
});

describe('damaged uploads', () => {
  it('reports an empty upload', async () => {
    const inspection = await inspectZipBytes(Buffer.alloc(0));
    expect(inspection.issues).toEqual([
      expect.objectContaining({ file: 'upload.zip', message: 'empty file (0 bytes)' }),
    ]);
  });

  it('reports a text file named .zip as not a zip', async () => {
    const inspection = await inspectZipBytes(Buffer.from('t,x,y,theta\n0,0,0,0\n'));
    expect(inspection.issues).toEqual([
      expect.objectContaining({
        file: 'upload.zip',
        message: 'not a zip file',
        found: 'content starting with "t,x,"',
      }),
    ]);
  });

  it('reports a truncated zip', async () => {
    const dir = await makeTempDir();
    const whole = await readFile(await writeBundleZip(join(dir, 'whole.zip'), makeBundleFiles()));
    const inspection = await inspectZipBytes(whole.subarray(0, Math.floor(whole.length / 2)));
    expect(inspection.ok).toBe(false);
    expect(inspection.issues[0]).toMatchObject({
      file: 'upload.zip',
      message: expect.stringMatching(/^truncated or damaged zip/),
    });
  });

  it('reports an entry whose bytes do not match its CRC-32 (APPNOTE 4.4.7)', async () => {
    const entries = bundleEntries();
    const bytes = buildRawZip(entries.map((entry) => ({ ...entry, method: 'store' as const })));
    const at = bytes.indexOf('incident-bundle/1');
    bytes[at] = 'J'.charCodeAt(0); // same size, different content
    const inspection = await inspectZipBytes(bytes);
    expect(inspection.issues).toContainEqual(
      expect.objectContaining({ file: 'manifest.json', message: expect.stringMatching(/CRC-32/) }),
    );
  });
});
