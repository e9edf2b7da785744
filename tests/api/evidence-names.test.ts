import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readZipEntries } from '../archive/rewrite-zip';
import { downloadArchive } from '../support/archive-samples';
import { makeTempDir } from '../support/bundle-fixtures';
import { as, SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import { type CaseWithReplay, caseWithReplay, createBookmark } from '../support/evidence-samples';
import { createTestApp, type TestApp } from '../support/test-app';

// Citations store ids and hashes; people must see what they are called and open them. The names
// here are the ones this test gave the items, not anything the server derived.
let t: TestApp;
let fixture: CaseWithReplay;
let bookmarkId: string;
const RETURN_COMMENT = 'Cite the moment the belief split, not only the whole replay.';

beforeAll(async () => {
  t = await createTestApp();
  fixture = await caseWithReplay(t);
  bookmarkId = await createBookmark(t, fixture.caseId, fixture.replayId);
  const draft = {
    ...SAMPLE_FINDINGS,
    evidence: [
      { type: 'replay', replayId: fixture.replayId, digest: fixture.digest },
      { type: 'bookmark', bookmarkId, note: 'Where the split shows' },
    ],
  };
  expect((await as(t, 'investigator').put(`/api/cases/${fixture.caseId}/findings`, draft)).status).toBe(200);
  const submitted = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/findings/submit`);
  expect(submitted.status).toBe(201);
  const returned = await as(t, 'reviewer').post(
    `/api/cases/${fixture.caseId}/findings/versions/${submitted.body.version}/return`,
    { comment: RETURN_COMMENT },
  );
  expect(returned.status).toBe(200);
}, 240_000);
afterAll(() => t.close());

describe('GET /api/cases/:id/evidence-names', () => {
  it('names every citable item of the case', async () => {
    const res = await as(t, 'legal').get(`/api/cases/${fixture.caseId}/evidence-names`);
    expect(res.status).toBe(200);
    expect(res.body.bookmarks).toEqual([
      expect.objectContaining({
        id: bookmarkId,
        note: 'Belief splits here, just before the rack corner.',
        t: 0.3,
        replayId: fixture.replayId,
      }),
    ]);
    expect(res.body.replays.map((r: { id: string }) => r.id)).toEqual([fixture.replayId]);
    expect(res.body.bundles[0]).toMatchObject({ id: fixture.bundleId, originalName: 'bundle.zip' });
  });

  it('answers 404 with a plain message for an unknown case', async () => {
    const res = await as(t, 'investigator').get(
      '/api/cases/00000000-0000-4000-8000-000000000000/evidence-names',
    );
    expect(res.status).toBe(404);
    expect(res.body.error.message).toMatch(/No case/);
  });
});

describe("the archive's report.html", () => {
  it('lists every cited item by name, the reviewer’s comment and the audit trail in order', async () => {
    const file = await downloadArchive(t, fixture.caseId, await makeTempDir('driftcase-names-'));
    const report = (await readZipEntries(file)).get('report.html')?.toString('utf8') ?? '';
    expect(report).toContain('Evidence cited (2 items)');
    expect(report).toContain('Bookmark: Belief splits here, just before the rack corner.');
    expect(report).toContain('at 0.3 s in replay');
    expect(report).toContain(fixture.digest);
    expect(report).toContain('Where the split shows');
    expect(report).toContain(RETURN_COMMENT);
    expect(report).toContain('Audit trail in order');
    const submittedAt = report.indexOf('Findings submitted');
    const returnedAt = report.indexOf('Findings returned', submittedAt);
    expect(submittedAt).toBeGreaterThan(-1);
    expect(returnedAt).toBeGreaterThan(submittedAt);
  }, 120_000);
});
