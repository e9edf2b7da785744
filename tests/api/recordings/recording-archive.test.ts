import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyArchive } from '../../../api/src/archive/verify-archive';
import type { TArchiveManifest } from '../../../shared/contracts/archives';
import { readZipEntries } from '../../archive/rewrite-zip';
import { downloadArchive } from '../../support/archive-samples';
import { type CaseTestbed, createCaseTestbed } from '../../support/case-testbed';
import { writeMcap } from '../../support/recordings/write-mcap';

/**
 * The evidence archive carries the robot recording itself, not only the bundle made from it:
 * the original's bytes, listed in manifest.json with a SHA-256 computed here by Node's own
 * implementation (FIPS 180-4), and `recordings/originals.json` naming the bundle it became. The
 * MCAP comes from @mcap/core's own writer.
 */
const SAMPLE = path.resolve('sample-logs/wheel-slip');
const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

let bed: CaseTestbed;
let mcap: string;
let unreadable: string;
let bundleSha256: string;
let entries: Map<string, Buffer>;
let archive: string;

beforeAll(async () => {
  bed = await createCaseTestbed();
  mcap = await writeMcap(SAMPLE, path.join(bed.dir, 'wren-aisle 4.mcap'), {
    compression: 'zstd',
    scanLimit: 120,
  });
  const auth = { Authorization: `Bearer ${bed.token}` };
  const read = await request(bed.t.app)
    .post(`/api/cases/${bed.caseId}/recordings`)
    .set(auth)
    .attach('recording', mcap);
  if (read.status !== 201) throw new Error(`recording upload: ${read.status} ${JSON.stringify(read.body)}`);
  bundleSha256 = read.body.bundle.sha256;
  unreadable = path.join(bed.dir, 'half-written.mcap');
  fs.writeFileSync(unreadable, 'the recorder stopped before writing anything useful');
  const failed = await request(bed.t.app)
    .post(`/api/cases/${bed.caseId}/recordings`)
    .set(auth)
    .attach('recording', unreadable);
  if (failed.status !== 422) throw new Error(`unreadable recording: ${failed.status}`);
  archive = await downloadArchive(bed.t, bed.caseId, bed.dir);
  entries = await readZipEntries(archive);
}, 240_000);
afterAll(() => bed.close());

describe('robot recordings in the evidence archive', () => {
  it('holds the recording byte for byte, listed in the manifest with its SHA-256', () => {
    const original = fs.readFileSync(mcap);
    const expected = sha256(original);
    const archived = entries.get(`recordings/${expected}/wren-aisle_4.mcap`);
    expect(archived?.equals(original)).toBe(true);
    const manifest = JSON.parse(String(entries.get('manifest.json'))) as TArchiveManifest;
    expect(manifest.files).toContainEqual({
      path: `recordings/${expected}/wren-aisle_4.mcap`,
      size: original.length,
      sha256: expected,
    });
    // The bundle made from it is archived as before.
    expect(entries.has(`bundles/${bundleSha256}/original.zip`)).toBe(true);
  });

  it('lists each original with the bundle it became, or none when it could not be read', () => {
    const listed = JSON.parse(String(entries.get('recordings/originals.json')));
    expect(listed).toEqual([
      {
        sha256: sha256(fs.readFileSync(mcap)),
        sizeBytes: fs.statSync(mcap).size,
        role: 'recording',
        name: 'wren-aisle 4.mcap',
        bundleSha256,
        path: `recordings/${sha256(fs.readFileSync(mcap))}/wren-aisle_4.mcap`,
      },
      {
        sha256: sha256(fs.readFileSync(unreadable)),
        sizeBytes: fs.statSync(unreadable).size,
        role: 'recording',
        name: 'half-written.mcap',
        bundleSha256: null,
        path: `recordings/${sha256(fs.readFileSync(unreadable))}/half-written.mcap`,
      },
    ]);
    expect(entries.get(String(listed[1].path))?.equals(fs.readFileSync(unreadable))).toBe(true);
  });

  it('names the recording and its SHA-256 in report.html', () => {
    const report = String(entries.get('report.html'));
    expect(report).toContain('Robot recording originals');
    expect(report).toContain('<td>wren-aisle 4.mcap</td><td>Recording</td>');
    expect(report).toContain(sha256(fs.readFileSync(mcap)));
  });

  it('still verifies: every file, the added ones included, matches the manifest', async () => {
    const result = await verifyArchive(archive, { skipReplays: true });
    const failed = result.checks.filter((check) => !check.ok && !check.unanchored);
    expect(failed).toEqual([]);
    const recordingPath = `recordings/${sha256(fs.readFileSync(mcap))}/wren-aisle_4.mcap`;
    expect(result.checks.filter((check) => check.file === recordingPath).map((c) => c.ok)).toEqual([true]);
  });

  it('does not list the recording originals as orphans: their custody entries account for them', async () => {
    const admin = await bed.t.tokenFor('admin');
    const res = await request(bed.t.app)
      .get('/api/evidence/orphans')
      .set('Authorization', `Bearer ${admin}`)
      .expect(200);
    const listed = res.body.unrecorded.map((file: { sha256: string }) => file.sha256);
    expect(listed).not.toContain(sha256(fs.readFileSync(mcap)));
    expect(listed).not.toContain(sha256(fs.readFileSync(unreadable)));
  });
});
