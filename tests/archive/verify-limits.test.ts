import fs from 'node:fs';
import path from 'node:path';
import { crc32, deflateRawSync } from 'node:zlib';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyArchive } from '../../api/src/archive/verify-archive';
import { makeTempDir } from '../support/bundle-fixtures';
import { buildRawZip } from '../support/raw-zip';
import { createTestApp, type TestApp } from '../support/test-app';

// A verification request must do bounded work: the archive is unpacked with the bundle reader's
// limits (zip directory checked first, inflated bytes counted as they come) and only the small
// documents it checks are held in memory.

const MiB = 1024 * 1024;
let dir: string;
let t: TestApp;

/** `count` entries of `mib` MiB of zeros each, deflated once (a few hundred KiB on disk in all). */
function zerosZip(
  names: (i: number) => string,
  count: number,
  mib: number,
  declared?: number,
  extra: { name: string; data: Buffer }[] = [],
): string {
  const zeros = Buffer.alloc(mib * MiB);
  const packed = deflateRawSync(zeros, { level: 9 });
  const checksum = crc32(zeros);
  const file = path.join(dir, `zeros-${count}x${mib}-${names(0).replace(/\W/g, '')}.zip`);
  fs.writeFileSync(
    file,
    buildRawZip([
      ...extra,
      ...Array.from({ length: count }, (_, i) => ({
        name: names(i),
        data: Buffer.alloc(0),
        packed,
        crc: checksum,
        declaredSize: declared ?? zeros.length,
      })),
    ]),
  );
  return file;
}

beforeAll(async () => {
  dir = await makeTempDir('driftcase-verify-limits-');
  t = await createTestApp();
});
afterAll(() => t.close());

describe('archive verification limits', () => {
  it('refuses 30 entries of 100 MiB of zeros from the zip directory, naming an entry, before unpacking', async () => {
    const file = zerosZip((i) => `replays/r${i}/series.csv`, 30, 100);
    expect(fs.statSync(file).size).toBeLessThan(5 * MiB);
    const result = await verifyArchive(file);
    expect(result.ok).toBe(false);
    expect(result.checks).toContainEqual(
      expect.objectContaining({
        kind: 'file',
        ok: false,
        file: 'replays/r0/series.csv',
        message: expect.stringMatching(
          /zip entry refused: unpacks too large at too high a compression ratio/,
        ),
      }),
    );
  }, 60_000);

  it('stops an entry that inflates past the size its directory declares', async () => {
    const file = zerosZip(() => 'report.html', 1, 80, 1024);
    const result = await verifyArchive(file);
    expect(result.ok).toBe(false);
    expect(result.checks).toContainEqual(
      expect.objectContaining({
        file: 'report.html',
        message: expect.stringMatching(/more than the 1024 bytes the zip directory declares/),
      }),
    );
  }, 60_000);

  it('refuses checked documents larger than the in-memory limit instead of holding them', async () => {
    // 60 MiB is under the per-entry size limit, so only the document limit stops these.
    const file = zerosZip((i) => `findings/v${i + 1}/version.json`, 30, 60);
    const result = await verifyArchive(file);
    expect(result.ok).toBe(false);
    expect(result.checks).toContainEqual(
      expect.objectContaining({
        file: 'findings/v1/version.json',
        message: expect.stringMatching(
          /archive document refused: 62914560 bytes, more than the 33554432 bytes/,
        ),
      }),
    );
  }, 60_000);

  it('streams large entries it does not need to read, reporting each as unlisted', async () => {
    const manifest = {
      format: 'driftcase-evidence-archive/1',
      case: { id: 'c', reference: 'INC-0', title: 'invented' },
      exportedAt: '2026-01-01T00:00:00Z',
      exportedBy: { id: 'u', email: 'someone@example.test', role: 'legal' },
      productVersion: '0',
      safetyCaution: '-',
      files: [],
    };
    const file = zerosZip((i) => `notes/n${i}.bin`, 4, 60, undefined, [
      { name: 'manifest.json', data: Buffer.from(JSON.stringify(manifest)) },
    ]);
    const result = await verifyArchive(file);
    const extras = result.checks.filter((c) => /extra file/.test(c.message));
    expect(extras.map((c) => c.file)).toEqual([
      'notes/n0.bin',
      'notes/n1.bin',
      'notes/n2.bin',
      'notes/n3.bin',
    ]);
  }, 120_000);

  it('answers POST /api/archives/verify with the refusal as a failed check, not an error', async () => {
    const file = zerosZip((i) => `bundles/b${i}/original.zip`, 30, 100);
    const res = await request(t.app)
      .post('/api/archives/verify')
      .set('Authorization', `Bearer ${await t.tokenFor('legal')}`)
      .attach('archive', file);
    expect(res.status).toBe(200);
    expect(res.body.ok).toBe(false);
    expect(res.body.checks[0].message).toMatch(/zip entry refused|zip refused/);
  }, 60_000);
});
