import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { validateBundleFiles } from '../../shared/bundle/validate-bundle-files';
import type { TReplay } from '../../shared/contracts/replays';
import { runReplay } from '../../shared/engine/filter';
import { resolveReplaySettings } from '../../shared/engine/settings';
import { readZipEntries } from '../archive/rewrite-zip';
import { downloadArchive } from '../support/archive-samples';
import { makeBundleFiles, writeBundleZip } from '../support/bundle-fixtures';
import { type CaseTestbed, createCaseTestbed } from '../support/case-testbed';
import { replayToEnd } from '../support/replay-runs';

// The README says derived/ can be rebuilt from the originals, so deleting it is a plausible
// operator action: every route that serves a derived file must then rebuild it (or answer with a
// JSON error), and never take the server down with an unhandled stream error.

let bed: CaseTestbed;
let bundleId: string;
let tableNames: string[];
let replay: TReplay;
const files = makeBundleFiles({ steps: 60, beams: 9 });

const get = (url: string) =>
  request(bed.t.app)
    .get(url)
    .set('Authorization', `Bearer ${bed.token}`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
const replayFolder = () => path.join(bed.dataDir, 'derived', 'replays', replay.id);
const tablesFolder = () => path.join(bed.dataDir, 'derived', 'bundles', bundleId, 'tables');

beforeAll(async () => {
  bed = await createCaseTestbed();
  const zip = await writeBundleZip(path.join(bed.dir, 'derived.zip'), files);
  const uploaded = await request(bed.t.app)
    .post(`/api/cases/${bed.caseId}/bundles`)
    .set('Authorization', `Bearer ${bed.token}`)
    .attach('bundle', zip)
    .expect(201);
  bundleId = uploaded.body.bundle.id;
  tableNames = uploaded.body.bundle.tables.map((table: { name: string }) => table.name);
  replay = await replayToEnd(bed.t.app, bed.token, bundleId);
  expect(replay.status).toBe('done');
}, 120_000);
afterAll(() => bed.close());

describe('a derived replay file removed in turn', () => {
  const routes = () => [
    `/api/replays/${replay.id}/series`,
    `/api/replays/${replay.id}/disagreement`,
    `/api/replays/${replay.id}`,
  ];

  it.each(['series.json', 'disagreement.bin', 'keyframes.bin', 'safety.json', 'causes.json', 'result.json'])(
    'rebuilds %s from the original and answers the same bytes',
    async (name) => {
      const before = await Promise.all(routes().map((url) => get(url).expect(200)));
      fs.rmSync(path.join(replayFolder(), name));
      const after = await Promise.all(routes().map((url) => get(url).expect(200)));
      for (const [index, res] of after.entries()) expect(res.body.equals(before[index].body)).toBe(true);
      expect(fs.existsSync(path.join(replayFolder(), name))).toBe(true);
    },
    60_000,
  );

  it('rebuilds the whole folder and the series matches an in-process run of the engine', async () => {
    fs.rmSync(replayFolder(), { recursive: true });
    const res = await get(`/api/replays/${replay.id}/series`).expect(200);
    // Reference: the same bundle replayed in this process by the engine, outside the server.
    const parsed = validateBundleFiles(files);
    if (!parsed.ok) throw new Error('fixture should be valid');
    const settings = resolveReplaySettings(parsed.bundle.manifest);
    if (!settings.ok) throw new Error('fixture settings should resolve');
    const local = runReplay(parsed.bundle, settings.settings);
    const body = JSON.parse(res.body.toString('utf8'));
    expect(body.columns.x).toHaveLength(local.series.x.length);
    expect(body.columns.x[10]).toBe(local.series.x[10]);
    const step = await request(bed.t.app)
      .get(`/api/replays/${replay.id}/steps/5`)
      .set('Authorization', `Bearer ${bed.token}`)
      .expect(200);
    expect(step.body.step).toBe(5);
  }, 60_000);

  it('answers 500 as JSON for an unreadable file, and the server keeps serving', async () => {
    const file = path.join(replayFolder(), 'series.json');
    fs.rmSync(file);
    fs.mkdirSync(file); // a folder where the file should be: present but unreadable as a file
    const res = await request(bed.t.app)
      .get(`/api/replays/${replay.id}/series`)
      .set('Authorization', `Bearer ${bed.token}`)
      .expect(500);
    expect(res.body.error.code).toBe('internal');
    expect(res.body.error.message).toMatch(/replay/);
    fs.rmSync(file, { recursive: true });
    await get(`/api/replays/${replay.id}/series`).expect(200);
    await request(bed.t.app).get('/api/health').expect(200);
  }, 60_000);
});

describe('an archive exported after the replay folder was removed', () => {
  it('still holds the finished replay, rebuilt from the original', async () => {
    fs.rmSync(replayFolder(), { recursive: true, force: true });
    const zip = await downloadArchive(bed.t, bed.caseId, bed.dir, 'after-removal.zip');
    const entries = await readZipEntries(zip);
    expect(entries.get(`replays/${replay.id}/digest`)?.toString('utf8').trim()).toBe(replay.digest);
  }, 120_000);
});

describe('a derived Arrow table removed in turn', () => {
  it('has tables to test', () => expect(tableNames.length).toBeGreaterThan(1));

  it('rebuilds each table from the original and answers the same bytes', async () => {
    for (const name of tableNames) {
      const url = `/api/bundles/${bundleId}/tables/${name}`;
      const before = await get(url).expect(200);
      fs.rmSync(path.join(tablesFolder(), `${name}.arrow`));
      const after = await get(url).expect(200);
      expect(after.body.equals(before.body), name).toBe(true);
    }
  }, 60_000);

  it('rebuilds after the whole derived folder is deleted', async () => {
    fs.rmSync(path.join(bed.dataDir, 'derived'), { recursive: true });
    await get(`/api/bundles/${bundleId}/tables/${tableNames[0]}`).expect(200);
    await get(`/api/replays/${replay.id}/disagreement`).expect(200);
  }, 60_000);

  it('answers 500 as JSON for an unreadable table file, and the server survives', async () => {
    const file = path.join(tablesFolder(), `${tableNames[0]}.arrow`);
    fs.rmSync(file);
    fs.mkdirSync(file);
    const res = await request(bed.t.app)
      .get(`/api/bundles/${bundleId}/tables/${tableNames[0]}`)
      .set('Authorization', `Bearer ${bed.token}`)
      .expect(500);
    expect(res.body.error.code).toBe('internal');
    await request(bed.t.app).get('/api/health').expect(200);
  });
});
