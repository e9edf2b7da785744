import { createHash } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { verifyArchive } from '../../api/src/archive/verify-archive';
import { auditEntries } from '../../api/src/db/schema';
import type { Role } from '../../shared/roles';
import { readZipEntries } from '../archive/rewrite-zip';
import { downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as, createCase, createPerson, SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import { type CaseWithReplay, caseWithReplay } from '../support/evidence-samples';
import { createTestApp, type TestApp } from '../support/test-app';

/** The smallest valid PNG (1 × 1 px, one grey pixel), written out byte for byte. */
const TINY_PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);
const PLAIN_SVG = `<?xml version="1.0" encoding="UTF-8"?>
<svg xmlns="http://www.w3.org/2000/svg" width="40" height="20"><rect width="40" height="20" fill="#0072B2"/><use href="#a"/></svg>`;
const CAPTION = 'Map · Dock 4 replay · digest 0123456789ab… · step 3 · 0.30 s';
/** SHA-256 by Node's own hash, not by the server under test (FIPS 180-4). */
const sha256 = (bytes: Buffer | string) => createHash('sha256').update(bytes).digest('hex');
/** Where uploads wait before they are kept or refused (the test app's DATA_DIR, tests/support/test-app.ts). */
const INCOMING = path.join(os.tmpdir(), `driftcase-test-${process.pid}`, 'incoming');
const incomingCount = () => fs.readdirSync(INCOMING).length;

let t: TestApp;
let fixture: CaseWithReplay;
let outsiderToken: string;

beforeAll(async () => {
  t = await createTestApp();
  fixture = await caseWithReplay(t);
  const outsider = { email: 'figure.outsider@driftcase.example', password: 'long-enough-password' };
  await createPerson(t, { ...outsider, name: 'Oskar Lind', role: 'investigator' });
  outsiderToken = (await request(t.app).post('/api/auth/login').send(outsider)).body.token;
}, 120_000);
afterAll(() => t.close());

async function upload(
  bytes: Buffer | string,
  options: { name?: string; fields?: Record<string, string>; role?: Role; token?: string } = {},
) {
  const token = options.token ?? (await t.tokenFor(options.role ?? 'investigator'));
  let req = request(t.app)
    .post(`/api/cases/${fixture.caseId}/figures`)
    .set('Authorization', `Bearer ${token}`);
  for (const [name, value] of Object.entries(options.fields ?? { caption: CAPTION }))
    req = req.field(name, value);
  return req.attach('figure', Buffer.from(bytes), options.name ?? 'figure.png');
}

const figureEntries = async (targetId: string) =>
  t.database.db.select().from(auditEntries).where(eq(auditEntries.targetId, targetId));

async function readFile(figureId: string, role: Role = 'legal') {
  return request(t.app)
    .get(`/api/figures/${figureId}/file`)
    .set('Authorization', `Bearer ${await t.tokenFor(role)}`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
}

describe('saving a picture to the case as a figure', () => {
  let pngFigure: { id: string; sha256: string };

  it('stores a PNG under its SHA-256 with its caption and moment, audited in the same write', async () => {
    const res = await upload(TINY_PNG, {
      fields: { caption: CAPTION, replayId: fixture.replayId, step: '3' },
    });
    expect(res.status).toBe(201);
    expect(res.body.figure).toMatchObject({
      caseId: fixture.caseId,
      sha256: sha256(TINY_PNG),
      sizeBytes: TINY_PNG.length,
      mediaType: 'image/png',
      caption: CAPTION,
      replayId: fixture.replayId,
      step: 3,
    });
    pngFigure = res.body.figure;
    const entries = await figureEntries(pngFigure.id);
    expect(entries.map((e) => [e.action, e.caseId])).toEqual([['figure.store', fixture.caseId]]);
    expect(entries[0].details).toMatchObject({ sha256: sha256(TINY_PNG), mediaType: 'image/png', step: 3 });

    const listed = await as(t, 'reviewer').get(`/api/cases/${fixture.caseId}/figures`);
    expect(listed.body.items.map((f: { id: string }) => f.id)).toContain(pngFigure.id);
    // The same bytes again are the same figure: stored once, no second entry.
    const again = await upload(TINY_PNG);
    expect([again.status, again.body.duplicate, again.body.figure.id]).toEqual([200, true, pngFigure.id]);
    expect(await figureEntries(pngFigure.id)).toHaveLength(1);
  });

  it('keeps the same picture sent twice at once as one figure with one entry', async () => {
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="7" height="7"><title>twice</title></svg>`;
    const answers = await Promise.all([upload(svg), upload(svg)]);
    expect(answers.map((a) => a.status).sort()).toEqual([200, 201]);
    expect(answers[0].body.figure.id).toBe(answers[1].body.figure.id);
    expect(await figureEntries(answers[0].body.figure.id)).toHaveLength(1);
  });

  it('saves nothing when its audit entry cannot be written (a write and its entry commit together)', async () => {
    const db = t.database.db;
    // The database itself refuses the audit row, as a full disk would (tests/support/atomic-audit-suite.ts).
    await db.execute(
      sql.raw(`create or replace function figure_test_refuse() returns trigger language plpgsql as $$
        begin raise exception 'refused by a test trigger'; end $$`),
    );
    await db.execute(
      sql.raw(
        'create trigger figure_test_refuse before insert on audit_entries for each row execute function figure_test_refuse()',
      ),
    );
    const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="5" height="5"><title>unrecorded</title></svg>`;
    try {
      const res = await upload(svg);
      expect([res.status, res.body.error.code]).toEqual([500, 'audit_failed']);
    } finally {
      await db.execute(sql.raw('drop trigger figure_test_refuse on audit_entries'));
    }
    const listed = (await as(t, 'investigator').get(`/api/cases/${fixture.caseId}/figures`)).body.items;
    expect(listed.map((f: { sha256: string }) => f.sha256)).not.toContain(sha256(svg));
  });

  it('serves the stored bytes unchanged, under headers that let no picture run script (CSP sandbox, nosniff)', async () => {
    const res = await readFile(pngFigure.id);
    expect(res.status).toBe(200);
    expect(sha256(res.body as Buffer)).toBe(sha256(TINY_PNG));
    expect(res.headers['content-type']).toBe('image/png');
    // CSP Level 3: `sandbox` gives the document a unique origin with scripts off.
    expect(res.headers['content-security-policy']).toMatch(/default-src 'none'.*sandbox/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });

  it('accepts a plain SVG and serves it as SVG under the same policy', async () => {
    const res = await upload(PLAIN_SVG, { name: 'timeline.svg' });
    expect(res.status).toBe(201);
    expect(res.body.figure.mediaType).toBe('image/svg+xml');
    const file = await readFile(res.body.figure.id);
    expect((file.body as Buffer).toString('utf8')).toBe(PLAIN_SVG);
    expect(file.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(file.headers['content-security-policy']).toMatch(/sandbox/);
  });

  // Each refused file with the words its message must hold (common practice: name what is wrong).
  const REFUSED: [string, string | Buffer, RegExp][] = [
    [
      'an SVG with a script',
      `<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>`,
      /<script> element/,
    ],
    [
      'an SVG with an event handler',
      `<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>`,
      /event-handler attribute/,
    ],
    [
      'an SVG with HTML inside',
      `<svg xmlns="http://www.w3.org/2000/svg"><foreignObject><p>x</p></foreignObject></svg>`,
      /foreignObject/,
    ],
    [
      'an SVG linking elsewhere',
      `<svg xmlns="http://www.w3.org/2000/svg"><image href="https://tracker.example/x.png"/></svg>`,
      /link to another address/,
    ],
    [
      'an SVG with an entity-encoded script link',
      `<svg xmlns="http://www.w3.org/2000/svg"><a href="&#106;avascript&#58;alert(1)"><rect/></a></svg>`,
      /link to another address/,
    ],
    [
      'an SVG with entity declarations',
      `<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "b">]><svg xmlns="http://www.w3.org/2000/svg"/>`,
      /DOCTYPE/,
    ],
    ['an HTML page', '<!doctype html><html><script>alert(1)</script></html>', /only PNG and SVG/],
    ['a text file', 'belief drifted at 55 s', /only PNG and SVG/],
    ['an empty file', Buffer.alloc(0), /file is empty/],
    ['a cut-short PNG', TINY_PNG.subarray(0, 10), /cut short or damaged/],
  ];
  it.each(REFUSED)(
    'refuses %s with a plain-words 400 naming the field, and records nothing',
    async (_, bytes, words) => {
      const before = (await as(t, 'investigator').get(`/api/cases/${fixture.caseId}/figures`)).body.items
        .length;
      const waiting = incomingCount();
      const res = await upload(bytes, { name: 'picture.svg' });
      expect(incomingCount()).toBe(waiting);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
      expect(res.body.error.message).toMatch(words);
      expect(res.body.error.details).toEqual([expect.objectContaining({ path: 'figure' })]);
      const after = (await as(t, 'investigator').get(`/api/cases/${fixture.caseId}/figures`)).body.items
        .length;
      expect(after).toBe(before);
    },
  );

  it('refuses a missing file, a missing caption and a replay of another case by field', async () => {
    const token = await t.tokenFor('investigator');
    const noFile = await request(t.app)
      .post(`/api/cases/${fixture.caseId}/figures`)
      .set('Authorization', `Bearer ${token}`)
      .field('caption', CAPTION);
    expect([noFile.status, noFile.body.error.message]).toEqual([
      400,
      expect.stringMatching(/field "figure"/),
    ]);
    const noCaption = await upload(TINY_PNG, { fields: {} });
    expect(noCaption.status).toBe(400);
    expect(noCaption.body.error.details).toEqual([expect.objectContaining({ path: 'caption' })]);
    // NUL has no place in PostgreSQL text (tests/api/text-validation.test.ts covers JSON bodies).
    const nulCaption = await upload(TINY_PNG, { fields: { caption: 'Map\u0000at step 3' } });
    expect(nulCaption.status).toBe(400);
    expect(nulCaption.body.error.details).toEqual([expect.objectContaining({ path: 'caption' })]);
    const otherCase = await caseWithReplay(t);
    const foreign = await upload(TINY_PNG, { fields: { caption: CAPTION, replayId: otherCase.replayId } });
    expect(foreign.status).toBe(400);
    expect(foreign.body.error.details).toEqual([expect.objectContaining({ path: 'replayId' })]);
  }, 60_000);

  it('refuses a file over 10 MB with 413', async () => {
    const big = Buffer.concat([TINY_PNG, Buffer.alloc(10 * 1024 * 1024)]);
    const res = await upload(big);
    expect(res.status).toBe(413);
  });

  it('lets only members save and see figures', async () => {
    const outsider = await upload(TINY_PNG, { token: outsiderToken });
    expect([outsider.status, outsider.body.error.details.reason]).toEqual([403, 'not_a_member']);
    const file = await request(t.app)
      .get(`/api/figures/${pngFigure.id}/file`)
      .set('Authorization', `Bearer ${outsiderToken}`);
    expect(file.status).toBe(403);
    // Reviewers read figures but do not make evidence (README, "Roles").
    expect((await upload(TINY_PNG, { role: 'reviewer' })).status).toBe(403);
  });
});

describe('findings citing a figure, and the evidence archive', () => {
  it('refuses a citation whose SHA-256 is not the stored one, or whose figure is of another case', async () => {
    const figure = (await upload(`<svg xmlns="http://www.w3.org/2000/svg" width="3" height="3"/>`)).body
      .figure;
    const otherCaseId = await createCase(t, 'Another dock');
    const cite = (caseId: string, sha: string) =>
      as(t, 'investigator').put(`/api/cases/${caseId}/findings`, {
        ...SAMPLE_FINDINGS,
        evidence: [{ type: 'figure', figureId: figure.id, sha256: sha }],
      });
    expect((await cite(fixture.caseId, 'f'.repeat(64))).status).toBe(200);
    const wrongHash = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/findings/submit`);
    expect(wrongHash.status).toBe(400);
    expect(wrongHash.body.error.details).toEqual([expect.objectContaining({ path: 'evidence.0.sha256' })]);
    expect((await cite(otherCaseId, figure.sha256)).status).toBe(200);
    const foreign = await as(t, 'investigator').post(`/api/cases/${otherCaseId}/findings/submit`);
    expect(foreign.body.error.details).toEqual([expect.objectContaining({ path: 'evidence.0.figureId' })]);
  });

  it('carries the cited figure byte for byte, listed in the manifest with its hash and shown in report.html', async () => {
    const figure = (await upload(TINY_PNG)).body.figure;
    const saved = await as(t, 'investigator').put(`/api/cases/${fixture.caseId}/findings`, {
      ...SAMPLE_FINDINGS,
      evidence: [{ type: 'figure', figureId: figure.id, sha256: sha256(TINY_PNG) }],
    });
    expect(saved.status).toBe(200);
    expect((await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/findings/submit`)).status).toBe(
      201,
    );
    const file = await downloadArchive(t, fixture.caseId, await makeTempDir('driftcase-figure-archive-'));
    const entries = await readZipEntries(file);
    const archivePath = `figures/${sha256(TINY_PNG)}/figure-${sha256(TINY_PNG).slice(0, 12)}.png`;
    expect(sha256(entries.get(archivePath) as Buffer)).toBe(sha256(TINY_PNG));
    const manifest = JSON.parse((entries.get('manifest.json') as Buffer).toString('utf8'));
    expect(manifest.files).toContainEqual({
      path: archivePath,
      size: TINY_PNG.length,
      sha256: sha256(TINY_PNG),
    });
    const listed = JSON.parse((entries.get('figures/figures.json') as Buffer).toString('utf8'));
    expect(listed).toContainEqual(
      expect.objectContaining({ id: figure.id, caption: CAPTION, path: archivePath }),
    );
    const report = (entries.get('report.html') as Buffer).toString('utf8');
    expect(report).toContain(`Figure: ${CAPTION}`);
    expect(report).toContain(`src="data:image/png;base64,${TINY_PNG.toString('base64')}"`);
    expect(report).toContain(`<a href="${archivePath}">`);
    // The offline verifier accepts the archive with its figures, each checked against the manifest.
    const published = (await request(t.app).get('/api/keys').expect(200)).body;
    const verified = await verifyArchive(file, { trust: { keys: published.keys, label: 'GET /api/keys' } });
    expect(verified.checks.filter((c) => !c.ok)).toEqual([]);
  }, 120_000);
});
