import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as, SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import {
  bookmarkBody,
  type CaseWithReplay,
  caseWithReplay,
  createBookmark,
} from '../support/evidence-samples';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let fixture: CaseWithReplay;
/** A second investigator, who did not write the bookmarks under test. */
let otherInvestigatorToken: string;

beforeAll(async () => {
  t = await createTestApp();
  fixture = await caseWithReplay(t);
  await as(t, 'admin').post('/api/users', {
    email: 'second.investigator@driftcase.example',
    name: 'Ines Varga',
    role: 'investigator',
    password: 'long-enough-password',
  });
  otherInvestigatorToken = (
    await request(t.app)
      .post('/api/auth/login')
      .send({ email: 'second.investigator@driftcase.example', password: 'long-enough-password' })
  ).body.token;
});
afterAll(() => t.close());

const fieldPaths = (body: { error: { details?: { path: string }[] } }) =>
  (body.error.details ?? []).map((d) => d.path);

describe('bookmarks', () => {
  it('pins a moment with the replay digest copied in, and lists and reads it for every role', async () => {
    const created = await as(t, 'investigator').post(
      `/api/cases/${fixture.caseId}/bookmarks`,
      bookmarkBody(fixture.replayId),
    );
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      caseId: fixture.caseId,
      bundleId: fixture.bundleId,
      replayId: fixture.replayId,
      replayDigest: fixture.digest,
      step: 3,
      t: 0.3,
      view: { centerX: 4.2, centerY: -1.5, zoom: 40, followRobot: true, layers: ['particles', 'scan'] },
      author: { name: expect.any(String) },
    });
    expect(created.body.replayDigest).toMatch(/\S/);
    expect(Number.isNaN(Date.parse(created.body.createdAt))).toBe(false);

    const listed = await as(t, 'legal').get(`/api/cases/${fixture.caseId}/bookmarks`);
    expect(listed.body.items.map((b: { id: string }) => b.id)).toContain(created.body.id);
    const read = await as(t, 'engineer').get(`/api/bookmarks/${created.body.id}`);
    expect(read.body.note).toBe(bookmarkBody(fixture.replayId).note);
  });

  it('refuses a step outside the replay, naming the field', async () => {
    const res = await as(t, 'investigator').post(
      `/api/cases/${fixture.caseId}/bookmarks`,
      bookmarkBody(fixture.replayId, { step: fixture.steps }),
    );
    expect(res.status).toBe(400);
    expect(fieldPaths(res.body)).toEqual(['step']);
    expect(res.body.error.message).toContain(`0 to ${fixture.steps - 1}`);
  });

  it('refuses a replay of another case', async () => {
    const other = await caseWithReplay(t);
    const res = await as(t, 'investigator').post(
      `/api/cases/${fixture.caseId}/bookmarks`,
      bookmarkBody(other.replayId),
    );
    expect(res.status).toBe(400);
    expect(fieldPaths(res.body)).toEqual(['replayId']);
  });

  it('names each malformed field by its path', async () => {
    const res = await as(t, 'investigator').post(`/api/cases/${fixture.caseId}/bookmarks`, {
      ...bookmarkBody(fixture.replayId),
      note: '  ',
      step: -1,
      view: { centerX: 1, centerY: 2, zoom: 0 },
    });
    expect(res.status).toBe(400);
    expect(fieldPaths(res.body).sort()).toEqual(['note', 'step', 'view.zoom']);
  });

  it('lets the author or an admin edit the note only', async () => {
    const id = await createBookmark(t, fixture.caseId, fixture.replayId);
    const edited = await as(t, 'investigator').patch(`/api/bookmarks/${id}`, {
      note: 'Scans disagree here.',
    });
    expect(edited.status).toBe(200);
    expect(edited.body.note).toBe('Scans disagree here.');
    expect(edited.body.step).toBe(3);
    const byAdmin = await as(t, 'admin').patch(`/api/bookmarks/${id}`, { note: 'Checked by admin.' });
    expect(byAdmin.status).toBe(200);
    const moved = await as(t, 'investigator').patch(`/api/bookmarks/${id}`, { note: 'x', step: 5 });
    expect(moved.status).toBe(400);

    const byOther = await request(t.app)
      .patch(`/api/bookmarks/${id}`)
      .set('Authorization', `Bearer ${otherInvestigatorToken}`)
      .send({ note: 'Not mine to change.' });
    expect(byOther.status).toBe(403);
  });

  it('deletes for the author only, and the bookmark is gone', async () => {
    const id = await createBookmark(t, fixture.caseId, fixture.replayId);
    const byOther = await request(t.app)
      .delete(`/api/bookmarks/${id}`)
      .set('Authorization', `Bearer ${otherInvestigatorToken}`);
    expect(byOther.status).toBe(403);
    expect((await as(t, 'investigator').delete(`/api/bookmarks/${id}`)).status).toBe(200);
    expect((await as(t, 'investigator').get(`/api/bookmarks/${id}`)).status).toBe(404);
  });

  it('refuses deletion with 409 on_hold while the case is under legal hold', async () => {
    const held = await caseWithReplay(t);
    const id = await createBookmark(t, held.caseId, held.replayId);
    await as(t, 'legal').post(`/api/cases/${held.caseId}/hold`, { reason: 'Insurer claim pending' });
    const res = await as(t, 'investigator').delete(`/api/bookmarks/${id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('on_hold');
    expect((await as(t, 'investigator').get(`/api/bookmarks/${id}`)).status).toBe(200);
  });

  it('keeps a bookmark that a submitted findings version cites', async () => {
    const cited = await caseWithReplay(t);
    const id = await createBookmark(t, cited.caseId, cited.replayId);
    const findings = { ...SAMPLE_FINDINGS, evidence: [{ type: 'bookmark', bookmarkId: id }] };
    expect((await as(t, 'investigator').put(`/api/cases/${cited.caseId}/findings`, findings)).status).toBe(
      200,
    );
    const submitted = await as(t, 'investigator').post(`/api/cases/${cited.caseId}/findings/submit`);
    expect(submitted.status).toBe(201);
    const res = await as(t, 'investigator').delete(`/api/bookmarks/${id}`);
    expect(res.status).toBe(409);
    expect(res.body.error.message).toContain('findings version 1');
  });

  it('records bookmark writes in the case audit trail', async () => {
    const id = await createBookmark(t, fixture.caseId, fixture.replayId);
    await as(t, 'investigator').patch(`/api/bookmarks/${id}`, { note: 'Audited edit.' });
    const audit = await as(t, 'reviewer').get(`/api/cases/${fixture.caseId}/audit`);
    const actions = audit.body.items
      .filter((e: { targetId: string }) => e.targetId === id)
      .map((e: { action: string }) => e.action);
    expect(actions).toEqual(expect.arrayContaining(['bookmark.create', 'bookmark.edit_note']));
  });
});
