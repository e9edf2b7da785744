import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBundleFiles, writeBundleZip } from '../support/bundle-fixtures';
import { type CaseTestbed, createCaseTestbed } from '../support/case-testbed';
import { buildRawZip } from '../support/raw-zip';

/**
 * Uploads lose nothing and never answer 500: a zip whose entry name holds NUL is stored and
 * recorded (row and audit entry) like any invalid bundle, a broken multipart body is the
 * client's 400, and the same new zip sent several times at once is one bundle.
 */
let bed: CaseTestbed;

beforeAll(async () => {
  bed = await createCaseTestbed();
}, 180_000);
afterAll(() => bed.close());

const upload = (file: string | Buffer, name = 'bundle.zip') =>
  request(bed.t.app)
    .post(`/api/cases/${bed.caseId}/bundles`)
    .set('Authorization', `Bearer ${bed.token}`)
    .attach('bundle', file, name);

async function caseAudit(): Promise<
  { action: string; targetId: string; details: Record<string, unknown> }[]
> {
  const res = await request(bed.t.app)
    .get(`/api/cases/${bed.caseId}/audit?pageSize=200`)
    .set('Authorization', `Bearer ${await bed.t.tokenFor('legal')}`)
    .expect(200);
  return res.body.items;
}

describe('uploads that lose nothing', () => {
  it('stores and records a zip with a NUL in an entry name, and answers with its problems', async () => {
    // A zip entry name is raw bytes (PKWARE APPNOTE 4.4.17); nothing stops a tool writing 0x00.
    const zip = buildRawZip([
      { name: 'manifest\u0000.json', data: Buffer.from('{}') },
      { name: 'odometry.csv', data: Buffer.from('t,x,y,theta\n0,0,0,0\n') },
    ]);
    const res = await upload(zip, 'nul-entry.zip');
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('invalid_bundle');
    const bundle = res.body.error.details.bundle;
    const stored = path.join(bed.dataDir, 'evidence', bundle.sha256.slice(0, 2), `${bundle.sha256}.bin`);
    expect(Buffer.compare(fs.readFileSync(stored), zip)).toBe(0);
    const listed = await request(bed.t.app)
      .get(`/api/bundles/${bundle.id}`)
      .set('Authorization', `Bearer ${bed.token}`)
      .expect(200);
    expect(listed.body.status).toBe('invalid');
    const entries = (await caseAudit()).filter(
      (e) => e.action === 'bundle.upload' && e.targetId === bundle.id,
    );
    expect(entries).toHaveLength(1);
  });

  it('answers 400, not 500, for a multipart body cut short', async () => {
    const boundary = 'driftcase-boundary-7f3a';
    const cut = `--${boundary}\r\nContent-Disposition: form-data; name="bundle"; filename="cut.zip"\r\nContent-Type: application/zip\r\n\r\nPK\u0003\u0004partial`;
    const res = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/bundles`)
      .set('Authorization', `Bearer ${bed.token}`)
      .set('Content-Type', `multipart/form-data; boundary=${boundary}`)
      .send(cut);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
    expect(res.body.error.message).toMatch(/multipart/);
    const left = fs.readdirSync(path.join(bed.dataDir, 'incoming'));
    expect(left).toEqual([]);
  });

  it('answers 400 for a multipart request without a boundary', async () => {
    const res = await request(bed.t.app)
      .post(`/api/cases/${bed.caseId}/bundles`)
      .set('Authorization', `Bearer ${bed.token}`)
      .set('Content-Type', 'multipart/form-data')
      .send('no parts here');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad_request');
  });

  it('makes one bundle of the same new zip uploaded four times at once', async () => {
    const zip = await writeBundleZip(path.join(bed.dir, 'same.zip'), makeBundleFiles({ steps: 9 }));
    const answers = await Promise.all([1, 2, 3, 4].map(() => upload(zip, 'same.zip')));
    const statuses = answers.map((res) => res.status).sort();
    expect(statuses).toEqual([200, 200, 200, 201]);
    const ids = new Set(answers.map((res) => res.body.bundle.id));
    expect(ids.size).toBe(1);
    expect(answers.filter((res) => res.body.duplicate === true)).toHaveLength(3);
    const [id] = ids;
    const entries = (await caseAudit()).filter((e) => e.action === 'bundle.upload' && e.targetId === id);
    expect(entries).toHaveLength(4);
    expect(entries.filter((e) => e.details.duplicate === true)).toHaveLength(3);
  });

  it('lists files no bundle accounts for to the admin, and deletes none of them', async () => {
    // What a kill -9 during an upload leaves: a partial file in incoming/, and an original
    // stored in evidence/ whose row was never written (named by a SHA-256 no bundle has).
    const partial = path.join(bed.dataDir, 'incoming', 'b1e2c3d4e5f60718293a4b5c6d7e8f90');
    fs.writeFileSync(partial, 'PK\u0003\u0004 half an upload');
    const sha = 'ab'.repeat(32);
    const unrecorded = path.join(bed.dataDir, 'evidence', 'ab', `${sha}.bin`);
    fs.mkdirSync(path.dirname(unrecorded), { recursive: true });
    fs.writeFileSync(unrecorded, 'an original without its row');

    const admin = await bed.t.tokenFor('admin');
    const res = await request(bed.t.app)
      .get('/api/evidence/orphans')
      .set('Authorization', `Bearer ${admin}`)
      .expect(200);
    expect(res.body.incoming.map((f: { path: string }) => f.path)).toEqual([
      'incoming/b1e2c3d4e5f60718293a4b5c6d7e8f90',
    ]);
    expect(res.body.unrecorded).toEqual([
      expect.objectContaining({ sha256: sha, path: `evidence/ab/${sha}.bin`, sizeBytes: 27 }),
    ]);
    expect(fs.existsSync(partial)).toBe(true);
    expect(fs.existsSync(unrecorded)).toBe(true);
    await request(bed.t.app)
      .get('/api/evidence/orphans')
      .set('Authorization', `Bearer ${bed.token}`)
      .expect(403);
  });
});
