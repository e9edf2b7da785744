import { execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import fs from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyArchive } from '../../api/src/archive/verify-archive';
import { ARCHIVE_FORMAT, type TArchiveManifest } from '../../shared/contracts/archives';
import { SAFETY_CAUTION } from '../../shared/safety-caution';
import { readZipEntries } from '../archive/rewrite-zip';
import { archivedCase, downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as } from '../support/case-work-fixtures';
import { findRawValues, htmlTextPieces } from '../support/raw-values';
import { createTestApp, type TestApp } from '../support/test-app';

/** Every entry of a zip as name → bytes (yauzl checks sizes; the CRC is checked by `unzip -t` below). */
const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex');

let t: TestApp;
let dir: string;
let caseId: string;
let first: string;
let second: string;

beforeAll(async () => {
  t = await createTestApp({ SITE_TIME_ZONE: 'Europe/Berlin' });
  dir = await makeTempDir('driftcase-archive-test-');
  ({ caseId } = await archivedCase(t));
  first = await downloadArchive(t, caseId, dir, 'first.zip');
  second = await downloadArchive(t, caseId, dir, 'second.zip');
}, 120_000);
afterAll(() => t.close());

describe('GET /api/cases/:id/archive', () => {
  it('passes a reference unzip test (Info-ZIP unzip -t checks every CRC-32)', () => {
    // Info-ZIP unzip is the reference reader on Debian; `-t` tests every entry's CRC.
    const output = execFileSync('unzip', ['-t', first], { encoding: 'utf8' });
    expect(output).toMatch(/No errors detected/);
  });

  it('lists every other file in manifest.json with the size and SHA-256 of its bytes', async () => {
    const entries = await readZipEntries(first);
    const manifest = JSON.parse(entries.get('manifest.json')!.toString('utf8')) as TArchiveManifest;
    expect(manifest.format).toBe(ARCHIVE_FORMAT);
    expect(manifest.safetyCaution).toBe(SAFETY_CAUTION);
    expect(manifest.exportedBy.role).toBe('legal');
    // RFC 3339 date-time with a Z offset.
    expect(manifest.exportedAt).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(\.\d+)?Z$/);
    const listed = manifest.files.map((f) => f.path).sort();
    const present = [...entries.keys()].filter((n) => n !== 'manifest.json' && n !== 'manifest.jws').sort();
    expect(listed).toEqual(present);
    for (const file of manifest.files) {
      const bytes = entries.get(file.path)!;
      expect({ path: file.path, size: bytes.length, sha256: sha256(bytes) }).toEqual(file);
    }
  });

  it('holds the original bundle byte for byte, the replay files, signed findings, keys, fixes and the audit chain', async () => {
    const entries = await readZipEntries(first);
    const token = await t.tokenFor('investigator');
    const bundles = await request(t.app)
      .get(`/api/cases/${caseId}/bundles`)
      .set('Authorization', `Bearer ${token}`);
    const original = await request(t.app)
      .get(`/api/bundles/${bundles.body.items[0].id}/original`)
      .set('Authorization', `Bearer ${token}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    const sha = bundles.body.items[0].sha256;
    expect(sha256(entries.get(`bundles/${sha}/original.zip`)!)).toBe(sha);
    expect(entries.get(`bundles/${sha}/original.zip`)!.equals(original.body as Buffer)).toBe(true);
    const names = [...entries.keys()];
    for (const pattern of [
      /^replays\/[^/]+\/settings\.json$/,
      /^replays\/[^/]+\/digest$/,
      /^replays\/[^/]+\/series\.csv$/,
      /^replays\/[^/]+\/flags\.json$/,
      /^replays\/[^/]+\/metrics\.json$/,
      /^findings\/v1\/canonical\.json$/,
      /^findings\/v1\/signatures\/signoff-1\.jws$/,
      /^keys\/jwks\.json$/,
      /^fixes\/fixes\.json$/,
      /^audit\/chain\.json$/,
      /^report\.html$/,
    ]) {
      expect(
        names.some((n) => pattern.test(n)),
        String(pattern),
      ).toBe(true);
    }
    const csvName = names.find((n) => n.endsWith('series.csv'))!;
    const replayId = csvName.split('/')[1];
    const replay = await request(t.app)
      .get(`/api/replays/${replayId}`)
      .set('Authorization', `Bearer ${token}`);
    // One CSV row per step plus the header.
    expect(entries.get(csvName)!.toString('utf8').trim().split('\n')).toHaveLength(replay.body.steps + 1);
    expect(entries.get(`replays/${replayId}/digest`)!.toString('utf8').trim()).toBe(replay.body.digest);
  });

  it('report.html reads in human values: site times with the zone named, words for every code', async () => {
    const report = (await readZipEntries(first)).get('report.html')!.toString('utf8');
    const pieces = htmlTextPieces(report);
    expect(findRawValues(pieces)).toEqual([]);
    // Times in Berlin carry CET or CEST (Directive 2000/84/EC); the footer names the zone in full.
    expect(report).toMatch(/\d{1,2} [A-Z][a-z]{2} \d{4}, \d{2}:\d{2} CES?T/);
    expect(report).toContain('Times are shown in Europe/Berlin');
    // Machines still get RFC 3339 in each <time datetime>.
    expect(report).toMatch(/<time datetime="\d{4}-\d{2}-\d{2}T[^"]+">/);
    expect(report).toContain('aria-label="Case path"');
    expect(report).toMatch(/role="img" aria-label="Severity: (Low|Medium|High|Critical)"/);
  });

  it('gives identical content files for an unchanged case, except the custody record of the earlier export', async () => {
    const a = await readZipEntries(first);
    const b = await readZipEntries(second);
    const differing = [...a.keys()].filter((name) => !b.get(name)?.equals(a.get(name)!));
    // manifest.json/.jws carry the export time; the audit chain and the report's custody section
    // gain the first export's entry; the checkpoint file gains the checkpoint signed at that export.
    expect(differing.sort()).toEqual([
      'audit/chain.json',
      'audit/checkpoints.jsonl',
      'manifest.json',
      'manifest.jws',
      'report.html',
    ]);
    const chainA = JSON.parse(a.get('audit/chain.json')!.toString('utf8'));
    const chainB = JSON.parse(b.get('audit/chain.json')!.toString('utf8'));
    expect(chainB.slice(0, chainA.length)).toEqual(chainA);
    expect(chainB.slice(chainA.length).map((e: { action: string }) => e.action)).toEqual(['archive.export']);
  });

  it('records custody: the audit trail holds the archive SHA-256 and the case lists the exports', async () => {
    const digest = sha256(fs.readFileSync(first));
    const list = await as(t, 'legal').get(`/api/cases/${caseId}/archives`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((i: { sha256: string }) => i.sha256)).toContain(digest);
    expect(list.body.items[0].exportedBy).toBe('legal@driftcase.example');
    const audit = await as(t, 'legal').get(`/api/cases/${caseId}/audit?pageSize=200`);
    const entry = audit.body.items.find(
      (e: { action: string; details: { sha256?: string } }) =>
        e.action === 'archive.export' && e.details.sha256 === digest,
    );
    expect(entry).toBeDefined();
    expect(entry.actorRole).toBe('legal');
    const chain = await as(t, 'legal').get(`/api/cases/${caseId}/audit/verify`);
    expect(chain.body.ok).toBe(true);
  });

  it('refuses other roles and answers 404 for an unknown case', async () => {
    expect((await as(t, 'investigator').get(`/api/cases/${caseId}/archive`)).status).toBe(403);
    expect((await as(t, 'legal').get('/api/cases/00000000-0000-4000-8000-000000000000/archive')).status).toBe(
      404,
    );
  });
});

describe('verifier on a fresh export', () => {
  it('passes every check, including re-running the replay to the same digest', async () => {
    const published = (await request(t.app).get('/api/keys').expect(200)).body;
    const result = await verifyArchive(first, { trust: { keys: published.keys, label: 'GET /api/keys' } });
    expect(result.checks.filter((c) => !c.ok)).toEqual([]);
    expect(result.ok).toBe(true);
    expect(result.checks.some((c) => c.kind === 'replay' && c.ok)).toBe(true);
    expect(result.checks.some((c) => c.kind === 'signature' && c.file?.startsWith('findings/'))).toBe(true);
  }, 60_000);

  it('answers the same checks over POST /api/archives/verify', async () => {
    const token = await t.tokenFor('reviewer');
    const res = await request(t.app)
      .post('/api/archives/verify')
      .set('Authorization', `Bearer ${token}`)
      .attach('archive', first);
    expect(res.status).toBe(200);
    expect(res.body.ok).toBe(true);
    expect(res.body.archiveSha256).toBe(sha256(fs.readFileSync(first)));
  }, 60_000);
});
