import fs from 'node:fs';
import path from 'node:path';
import type { JSONWebKeySet } from 'jose';
import request from 'supertest';
import type { Role } from '../../shared/roles';
import { readZipEntries } from '../archive/rewrite-zip';
import { makeBundleFiles, makeTempDir, writeBundleZip } from './bundle-fixtures';
import { as, caseWithDraft, signedCase } from './case-work-fixtures';
import { replayToEnd } from './replay-runs';
import type { TestApp } from './test-app';

/** Downloads a case archive as legal into `dir` and returns the file path. */
export async function downloadArchive(t: TestApp, caseId: string, dir: string, name = 'archive.zip') {
  const token = await t.tokenFor('legal');
  const res = await request(t.app)
    .get(`/api/cases/${caseId}/archive`)
    .set('Authorization', `Bearer ${token}`)
    .buffer(true)
    .parse((response, done) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => done(null, Buffer.concat(chunks)));
    });
  if (res.status !== 200) throw new Error(`archive export: got ${res.status} ${res.body}`);
  const file = path.join(dir, name);
  fs.writeFileSync(file, res.body as Buffer);
  return file;
}

/**
 * An invented case with a bundle, a finished replay, signed findings and a fix whose
 * verification replay is that replay: everything an archive holds.
 */
export async function archivedCase(t: TestApp): Promise<{ caseId: string; replayId: string }> {
  const { caseId } = await signedCase(t);
  const dir = await makeTempDir('driftcase-archive-case-');
  const zip = await writeBundleZip(path.join(dir, 'bundle.zip'), makeBundleFiles({ steps: 40 }));
  const token = await t.tokenFor('investigator');
  const bundle = await request(t.app)
    .post(`/api/cases/${caseId}/bundles`)
    .set('Authorization', `Bearer ${token}`)
    .attach('bundle', zip);
  if (bundle.status !== 201) throw new Error(`upload: ${bundle.status} ${JSON.stringify(bundle.body)}`);
  const replay = await replayToEnd(t.app, token, bundle.body.bundle.id, { overrides: { particles: 200 } });
  if (replay.status !== 'done') throw new Error(`replay ended ${replay.status}`);
  const fix = await as(t, 'engineer').post(`/api/cases/${caseId}/fixes`, {
    url: 'https://tracker.harbourline.example/CR-204',
    description: 'Scan matcher weight raised for the cold-store aisles',
    verificationReplayId: replay.id,
  });
  if (fix.status !== 201) throw new Error(`fix: ${fix.status} ${JSON.stringify(fix.body)}`);
  return { caseId, replayId: replay.id };
}

/**
 * A genuine archive of `archivedCase` in a new temp folder, its entries, and the server's published
 * keys (GET /api/keys) saved beside it: what a third party holds before checking an archive.
 */
export async function genuineArchive(t: TestApp, prefix: string) {
  const dir = await makeTempDir(prefix);
  const { caseId } = await archivedCase(t);
  const file = await downloadArchive(t, caseId, dir);
  const entries = await readZipEntries(file);
  const published: JSONWebKeySet = (await request(t.app).get('/api/keys').expect(200)).body;
  const publishedFile = path.join(dir, 'published-keys.json');
  fs.writeFileSync(publishedFile, JSON.stringify(published));
  return { dir, file, entries, published, publishedFile };
}

/** Role-matrix samples for the archive routes. */
export function archiveSamples(app: () => TestApp) {
  let archive: Promise<string> | undefined;
  const sampleArchive = async () => {
    archive ??= (async () => {
      const caseId = await caseWithDraft(app());
      return downloadArchive(app(), caseId, await makeTempDir('driftcase-archive-matrix-'));
    })();
    return archive;
  };
  return {
    'get /cases/:id/archive': (f: { caseId: string }) => ({ path: `/api/cases/${f.caseId}/archive` }),
    'get /cases/:id/archives': (f: { caseId: string }) => ({ path: `/api/cases/${f.caseId}/archives` }),
    'post /archives/verify': async (_f: { caseId: string }, _role?: Role | null) => ({
      path: '/api/archives/verify',
      attach: { field: 'archive', file: await sampleArchive() },
    }),
  };
}
