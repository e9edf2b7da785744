import { calculateJwkThumbprint, type JSONWebKeySet } from 'jose';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZipEntries } from '../archive/rewrite-zip';
import { downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as, caseWithDraft } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let dir: string;
let caseId: string;

const keys = async (): Promise<JSONWebKeySet> => (await request(t.app).get('/api/keys').expect(200)).body;
const verifyOverApi = async (file: string) =>
  (
    await request(t.app)
      .post('/api/archives/verify')
      .set('Authorization', `Bearer ${await t.tokenFor('legal')}`)
      .attach('archive', file)
      .expect(200)
  ).body;

beforeAll(async () => {
  t = await createTestApp({ DATA_DIR: await makeTempDir('driftcase-keys-') });
  dir = await makeTempDir('driftcase-keys-archives-');
  caseId = await caseWithDraft(t);
}, 120_000);
afterAll(() => t.close());

describe('signing key rotation', () => {
  it('shows the current key thumbprint (RFC 7638, as jose computes it) and puts it in report.html', async () => {
    const [current] = (await keys()).keys;
    const thumbprint = await calculateJwkThumbprint(current);
    const described = await request(t.app).get('/api/keys/thumbprints').expect(200);
    expect(described.body.current.thumbprint).toBe(thumbprint);
    const archive = await readZipEntries(await downloadArchive(t, caseId, dir, 'before.zip'));
    expect(archive.get('report.html')!.toString('utf8')).toContain(thumbprint);
  }, 60_000);

  it('is refused to anyone but an admin', async () => {
    for (const role of ['investigator', 'reviewer', 'legal', 'engineer'] as const) {
      expect((await as(t, role).post('/api/keys/rotate', {})).status, role).toBe(403);
    }
  });

  it('signs with a new key, keeps the retired one trusted for old archives, and is audited', async () => {
    const before = (await keys()).keys[0];
    const oldArchive = await downloadArchive(t, caseId, dir, 'old-key.zip');
    const rotated = await as(t, 'admin').post('/api/keys/rotate', {});
    expect(rotated.status).toBe(200);
    const after = await keys();
    expect(after.keys[0].kid).not.toBe(before.kid);
    expect(after.keys.map((k) => k.kid)).toContain(before.kid);
    expect(rotated.body.current.thumbprint).toBe(await calculateJwkThumbprint(after.keys[0]));
    expect(rotated.body.retired[0]).toMatchObject({
      kid: before.kid,
      thumbprint: await calculateJwkThumbprint(before),
    });

    // The old archive still verifies on the server; a new one is signed by the new key.
    expect((await verifyOverApi(oldArchive)).ok).toBe(true);
    const newArchive = await downloadArchive(t, caseId, dir, 'new-key.zip');
    const verified = await verifyOverApi(newArchive);
    expect(verified.ok).toBe(true);
    expect(verified.checks.find((c: { file: string }) => c.file === 'manifest.jws').message).toContain(
      after.keys[0].kid,
    );
    const report = (await readZipEntries(newArchive)).get('report.html')!.toString('utf8');
    expect(report).toContain(await calculateJwkThumbprint(after.keys[0]));

    const audit = await as(t, 'admin').get('/api/audit?pageSize=200');
    const entry = audit.body.items.find((e: { action: string }) => e.action === 'key.rotate');
    expect(entry).toMatchObject({
      actorRole: 'admin',
      details: { retiredKid: before.kid, newKid: after.keys[0].kid },
    });
  }, 120_000);
});
