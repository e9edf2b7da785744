import { createHash } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { tableFromIPC } from 'apache-arrow';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeBundleFiles, withFile, writeBundleZip } from '../support/bundle-fixtures';
import { type CaseTestbed, createCaseTestbed } from '../support/case-testbed';
import { createTestApp } from '../support/test-app';

let bed: CaseTestbed;
let t: CaseTestbed['t'];
let token: string;
let caseId: string;
let dir: string;
let dataDir: string;

beforeAll(async () => {
  bed = await createCaseTestbed();
  ({ t, token, caseId, dir, dataDir } = bed);
});
afterAll(() => bed.close());

const upload = (file: string, as = token) =>
  request(t.app)
    .post(`/api/cases/${caseId}/bundles`)
    .set('Authorization', `Bearer ${as}`)
    .attach('bundle', file);

const sha256 = (file: string) => createHash('sha256').update(fs.readFileSync(file)).digest('hex');

describe('bundle upload', () => {
  it('stores the original byte for byte, validates it and lists it on the case', async () => {
    const zip = await writeBundleZip(path.join(dir, 'good.zip'), makeBundleFiles({ steps: 30 }));
    const res = await upload(zip).expect(201);
    const bundle = res.body.bundle;
    expect(bundle.status).toBe('valid');
    // The stored original's SHA-256 equals Node's digest of the uploaded bytes.
    expect(bundle.sha256).toBe(sha256(zip));
    expect(bundle.sizeBytes).toBe(fs.statSync(zip).size);
    const stored = path.join(dataDir, 'evidence', bundle.sha256.slice(0, 2), `${bundle.sha256}.bin`);
    expect(Buffer.compare(fs.readFileSync(stored), fs.readFileSync(zip))).toBe(0);
    expect(fs.statSync(stored).mode & 0o222).toBe(0);
    expect(bundle.files.map((f: { name: string }) => f.name)).toContain('odometry.csv');
    expect(bundle.summary.rows.odometry).toBe(30);

    const list = await request(t.app)
      .get(`/api/cases/${caseId}/bundles`)
      .set('Authorization', `Bearer ${token}`)
      .expect(200);
    expect(list.body.items.map((b: { id: string }) => b.id)).toContain(bundle.id);
    const one = await request(t.app)
      .get(`/api/bundles/${bundle.id}`)
      .set('Authorization', `Bearer ${token}`)
      .expect(200);
    expect(one.body.sha256).toBe(bundle.sha256);
  });

  it('recognises the same bytes uploaded twice', async () => {
    const zip = await writeBundleZip(path.join(dir, 'twice.zip'), makeBundleFiles({ steps: 12 }));
    const first = await upload(zip).expect(201);
    const second = await upload(zip).expect(200);
    expect(second.body.duplicate).toBe(true);
    expect(second.body.bundle.id).toBe(first.body.bundle.id);
  });

  it('serves the derived Arrow tables with the right row counts', async () => {
    const zip = await writeBundleZip(path.join(dir, 'arrow.zip'), makeBundleFiles({ steps: 25 }));
    const { body } = await upload(zip).expect(201);
    const res = await request(t.app)
      .get(`/api/bundles/${body.bundle.id}/tables/odometry`)
      .set('Authorization', `Bearer ${token}`)
      .buffer(true)
      .parse((response, done) => {
        const chunks: Buffer[] = [];
        response.on('data', (c: Buffer) => chunks.push(c));
        response.on('end', () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect(res.headers['content-type']).toContain('application/vnd.apache.arrow.stream');
    expect(tableFromIPC(res.body as Buffer).numRows).toBe(25);
    await request(t.app)
      .get(`/api/bundles/${body.bundle.id}/tables/nope`)
      .set('Authorization', `Bearer ${token}`)
      .expect(404);
  });

  it('keeps an invalid bundle, answers 422 with located errors, and lists it as invalid', async () => {
    const files = withFile(
      makeBundleFiles({ steps: 10 }),
      'odometry.csv',
      't,x,y,theta\n0,0,0,0\n0.1,abc,0,0\n',
    );
    const zip = await writeBundleZip(path.join(dir, 'broken.zip'), files);
    const res = await upload(zip).expect(422);
    expect(res.body.error.code).toBe('invalid_bundle');
    const issue = res.body.error.details.issues.find((i: { file: string }) => i.file === 'odometry.csv');
    expect(issue).toMatchObject({ line: 3, field: 'x' });
    const listed = await request(t.app)
      .get(`/api/bundles/${res.body.error.details.bundle.id}`)
      .set('Authorization', `Bearer ${token}`);
    expect(listed.body.status).toBe('invalid');
    expect(listed.body.sha256).toBe(sha256(zip));
  });

  it('gives clear errors for an empty file, a non-zip and a truncated zip', async () => {
    const empty = path.join(dir, 'empty.zip');
    fs.writeFileSync(empty, '');
    const emptyRes = await upload(empty).expect(422);
    expect(emptyRes.body.error.details.issues[0].message).toMatch(/empty/i);

    const notZip = path.join(dir, 'notes.zip');
    fs.writeFileSync(notZip, 'these are my notes, not an archive');
    const notZipRes = await upload(notZip).expect(422);
    expect(notZipRes.body.error.details.issues[0].file).toBe('notes.zip');

    const whole = await writeBundleZip(path.join(dir, 'whole.zip'), makeBundleFiles({ steps: 40 }));
    const truncated = path.join(dir, 'truncated.zip');
    const bytes = fs.readFileSync(whole);
    fs.writeFileSync(truncated, bytes.subarray(0, Math.floor(bytes.length / 2)));
    const truncatedRes = await upload(truncated).expect(422);
    expect(truncatedRes.body.error.details.issues.length).toBeGreaterThan(0);
  });

  it('asks for the file when the field is missing and refuses other roles', async () => {
    const res = await request(t.app)
      .post(`/api/cases/${caseId}/bundles`)
      .set('Authorization', `Bearer ${token}`)
      .field('note', 'no file')
      .expect(400);
    expect(res.body.error.message).toMatch(/"bundle"/);
    // The role is refused before the body is read, so the refusal is checked with a body small
    // enough to be sent whole: a file still being written when the 403 arrives fails with EPIPE.
    const refused = await request(t.app)
      .post(`/api/cases/${caseId}/bundles`)
      .set('Authorization', `Bearer ${await t.tokenFor('legal')}`)
      .field('note', 'not my role')
      .expect(403);
    expect(refused.body.error.code).toBe('forbidden');
  });

  it('answers 413 when the upload is over the configured limit', async () => {
    const small = await createTestApp({ DATA_DIR: dataDir, MAX_UPLOAD_BYTES: '100' });
    const smallToken = await small.tokenFor('investigator');
    const cases = await request(small.app).get('/api/cases').set('Authorization', `Bearer ${smallToken}`);
    const zip = await writeBundleZip(path.join(dir, 'big.zip'), makeBundleFiles({ steps: 50 }));
    const res = await request(small.app)
      .post(`/api/cases/${cases.body.items[0].id}/bundles`)
      .set('Authorization', `Bearer ${smallToken}`)
      .attach('bundle', zip)
      .expect(413);
    expect(res.body.error.code).toBe('payload_too_large');
    await small.close();
  });
});
