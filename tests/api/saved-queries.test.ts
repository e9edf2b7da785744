import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as } from '../support/case-work-fixtures';
import { type CaseWithReplay, caseWithReplay, savedQueryBody } from '../support/evidence-samples';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let fixture: CaseWithReplay;

beforeAll(async () => {
  t = await createTestApp();
  fixture = await caseWithReplay(t);
});
afterAll(() => t.close());

const fieldPaths = (body: { error: { details?: { path: string }[] } }) =>
  (body.error.details ?? []).map((d) => d.path);

describe('saved queries', () => {
  it('saves a query with its result hash and lists and reads it for every role', async () => {
    const body = savedQueryBody(fixture.bundleId);
    // Independent check of the documented canonical form: RFC 8785 text hashed with Node's SHA-256.
    const canonical = '{"columns":["kind","events"],"rows":[["contact",1],["protective_stop",2]]}';
    expect(body.resultSha256).toBe(createHash('sha256').update(canonical).digest('hex'));

    const saved = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/queries`, body);
    expect(saved.status).toBe(201);
    expect(saved.body).toMatchObject({
      caseId: fixture.caseId,
      bundleId: fixture.bundleId,
      title: body.title,
      sql: body.sql,
      resultSha256: body.resultSha256,
      rowCount: 2,
      columns: ['kind', 'events'],
      preview: body.preview,
      isHashCheckedByServer: true,
    });
    const listed = await as(t, 'reviewer').get(`/api/cases/${fixture.caseId}/queries`);
    expect(listed.body.items.map((q: { id: string }) => q.id)).toContain(saved.body.id);
    const read = await as(t, 'legal').get(`/api/queries/${saved.body.id}`);
    expect(read.body.resultSha256).toBe(body.resultSha256);
  });

  it('refuses a hash that does not match a preview holding the whole result', async () => {
    const body = savedQueryBody(fixture.bundleId, { resultSha256: 'b'.repeat(64) });
    const res = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/queries`, body);
    expect(res.status).toBe(400);
    expect(fieldPaths(res.body)).toEqual(['resultSha256']);
    expect(res.body.error.message).toContain(savedQueryBody(fixture.bundleId).resultSha256);
  });

  it('stores a partial preview without checking, and says so', async () => {
    const body = savedQueryBody(fixture.bundleId, { rowCount: 1200, resultSha256: 'c'.repeat(64) });
    const res = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/queries`, body);
    expect(res.status).toBe(201);
    expect(res.body.isHashCheckedByServer).toBe(false);
  });

  it('names malformed fields by path', async () => {
    const res = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/queries`, {
      ...savedQueryBody(fixture.bundleId),
      title: '',
      resultSha256: 'XYZ',
      preview: [['contact', 1], ['protective_stop']],
    });
    expect(res.status).toBe(400);
    expect(fieldPaths(res.body).sort()).toEqual(['preview.1', 'resultSha256', 'title']);
  });

  it('refuses a bundle of another case', async () => {
    const other = await caseWithReplay(t);
    const res = await as(t, 'investigator').post(
      `/api/cases/${fixture.caseId}/queries`,
      savedQueryBody(other.bundleId),
    );
    expect(res.status).toBe(400);
    expect(fieldPaths(res.body)).toEqual(['bundleId']);
  });

  it('answers 404 for an unknown saved query', async () => {
    const res = await as(t, 'engineer').get('/api/queries/00000000-0000-4000-8000-000000000000');
    expect(res.status).toBe(404);
  });
});
