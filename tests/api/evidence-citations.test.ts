import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as, SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import { caseWithReplay, createBookmark, savedQueryBody } from '../support/evidence-samples';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

async function submitWithEvidence(caseId: string, evidence: object[]) {
  await as(t, 'investigator').put(`/api/cases/${caseId}/findings`, { ...SAMPLE_FINDINGS, evidence });
  return as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`);
}

describe('findings citing bookmarks and saved queries', () => {
  it('accepts citations of this case’s bookmark and saved query with its stored hash', async () => {
    const fixture = await caseWithReplay(t);
    const bookmarkId = await createBookmark(t, fixture.caseId, fixture.replayId);
    const query = savedQueryBody(fixture.bundleId);
    const saved = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/queries`, query);
    const res = await submitWithEvidence(fixture.caseId, [
      { type: 'bookmark', bookmarkId },
      { type: 'saved_query', queryId: saved.body.id, resultSha256: query.resultSha256 },
    ]);
    expect(res.status).toBe(201);
  });

  it('refuses unknown items, items of another case and a changed result hash, naming each field', async () => {
    const fixture = await caseWithReplay(t);
    const other = await caseWithReplay(t);
    const otherBookmark = await createBookmark(t, other.caseId, other.replayId);
    const query = savedQueryBody(fixture.bundleId);
    const saved = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/queries`, query);
    const res = await submitWithEvidence(fixture.caseId, [
      { type: 'bookmark', bookmarkId: '6f1c2a1e-3b7d-4d3a-9a51-0c2f3e4b5a61' },
      { type: 'bookmark', bookmarkId: otherBookmark },
      { type: 'saved_query', queryId: saved.body.id, resultSha256: 'a'.repeat(64) },
      { type: 'saved_query', queryId: '0b7e9d12-5c44-4f0e-8a2b-6e1d9f3c7a20', resultSha256: 'a'.repeat(64) },
    ]);
    expect(res.status).toBe(400);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual([
      'evidence.0.bookmarkId',
      'evidence.1.bookmarkId',
      'evidence.2.resultSha256',
      'evidence.3.queryId',
    ]);
    expect(res.body.error.message).toContain(query.resultSha256);
  });
});
