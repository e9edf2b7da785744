import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TAuditList } from '../../shared/contracts/audit';
import { as, caseWithDraft, SAMPLE_FINDINGS, submittedCase } from '../support/case-work-fixtures';
import {
  bookmarkBody,
  type CaseWithReplay,
  caseWithReplay,
  createBookmark,
} from '../support/evidence-samples';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * The legal-hold policy (README, "Legal hold"): while a hold is active nothing already recorded on
 * the case changes — the case record and its status, findings, bookmarks and their notes — and
 * additions are allowed and audited. Preservation orders ask that relevant records be kept
 * unaltered (common practice in litigation holds, e.g. US Federal Rules of Civil Procedure 37(e);
 * the exact scope here is our policy).
 */
let t: TestApp;
let held: CaseWithReplay;
let bookmarkId: string;
let heldSubmitted: { caseId: string; version: number };

const HOLD_REASON = 'Insurer claim notice 2026-11-30';
/** The demo legal account that places the holds (api/src/seed/demo-people.ts). */
const PLACED_BY = 'Leah Marchetti (legal@driftcase.example)';

async function placeHold(caseId: string) {
  const res = await as(t, 'legal').post(`/api/cases/${caseId}/hold`, { reason: HOLD_REASON });
  expect(res.status).toBe(201);
}

async function auditActions(caseId: string): Promise<string[]> {
  const res = await as(t, 'legal').get(`/api/cases/${caseId}/audit?pageSize=200`);
  return (res.body as TAuditList).items.map((entry) => entry.action);
}

beforeAll(async () => {
  t = await createTestApp();
  held = await caseWithReplay(t);
  bookmarkId = await createBookmark(t, held.caseId, held.replayId);
  await as(t, 'investigator').put(`/api/cases/${held.caseId}/findings`, SAMPLE_FINDINGS);
  await placeHold(held.caseId);
  heldSubmitted = await submittedCase(t);
  await placeHold(heldSubmitted.caseId);
}, 300_000);
afterAll(() => t.close());

/** Every write route that changes something already recorded on a case, with a call made under hold. */
const REFUSED: Record<
  string,
  () => {
    role: Parameters<typeof as>[1];
    method: 'patch' | 'put' | 'post' | 'delete';
    path: string;
    body?: object;
  }
> = {
  'patch /cases/:id (summary)': () => ({
    role: 'investigator',
    method: 'patch',
    path: `/api/cases/${held.caseId}`,
    body: { summary: 'quiet rewrite' },
  }),
  'patch /cases/:id (title, severity)': () => ({
    role: 'admin',
    method: 'patch',
    path: `/api/cases/${held.caseId}`,
    body: { title: 'Renamed while held', severity: 'low' },
  }),
  'patch /cases/:id (status)': () => ({
    role: 'investigator',
    method: 'patch',
    path: `/api/cases/${held.caseId}`,
    body: { status: 'closed' },
  }),
  'post /cases/:id/transitions': () => ({
    role: 'investigator',
    method: 'post',
    path: `/api/cases/${held.caseId}/transitions`,
    body: { to: 'closed', comment: 'Closing under hold' },
  }),
  'put /cases/:id/findings': () => ({
    role: 'investigator',
    method: 'put',
    path: `/api/cases/${held.caseId}/findings`,
    body: { ...SAMPLE_FINDINGS, summary: 'Edited under hold' },
  }),
  'post /cases/:id/findings/submit': () => ({
    role: 'investigator',
    method: 'post',
    path: `/api/cases/${held.caseId}/findings/submit`,
  }),
  'post /cases/:id/findings/versions/:v/signoff': () => ({
    role: 'reviewer',
    method: 'post',
    path: `/api/cases/${heldSubmitted.caseId}/findings/versions/${heldSubmitted.version}/signoff`,
    body: { acknowledgeCaution: true },
  }),
  'post /cases/:id/findings/versions/:v/return': () => ({
    role: 'reviewer',
    method: 'post',
    path: `/api/cases/${heldSubmitted.caseId}/findings/versions/${heldSubmitted.version}/return`,
    body: { comment: 'Please cite the replay.' },
  }),
  'patch /bookmarks/:id': () => ({
    role: 'investigator',
    method: 'patch',
    path: `/api/bookmarks/${bookmarkId}`,
    body: { note: 'Rewritten under hold' },
  }),
  'delete /bookmarks/:id': () => ({
    role: 'investigator',
    method: 'delete',
    path: `/api/bookmarks/${bookmarkId}`,
  }),
};

/** Write routes that add to a case (allowed under hold) or do not touch a case's records. */
const ALLOWED = new Set([
  'post /cases/:id/bookmarks',
  'post /cases/:id/queries',
  'post /cases/:id/bundles',
  'post /cases/:id/recordings', // a new original and its bundle: an addition, like a bundle upload
  'post /cases/:id/figures', // a new picture kept as evidence: an addition, nothing recorded changes
  'post /bundles/:id/replays',
  'delete /replays/:id', // cancels a running replay; a finished replay's results are kept
  'post /cases/:id/fixes',
  'post /cases/:id/fixes/:fixId/verify', // records a verification beside the fix
  'delete /cases/:id/hold',
  'post /cases/:id/hold',
  // Who works on a case is not part of its record: legal may need new people on a held case.
  'post /cases/:id/members',
  'delete /cases/:id/members/:userId',
]);
const NOT_CASE_DATA = /^(post|patch|delete) \/(auth|users|keys\/rotate|archives\/verify|cases$)/;

describe('legal hold freezes the record', () => {
  it('classifies every write route as frozen, allowed or not about a case', () => {
    const writes = t.app.locals.routeSpecs
      .filter((spec) => spec.method !== 'get')
      .map((spec) => `${spec.method} ${spec.path}`);
    const frozen = new Set(Object.keys(REFUSED).map((name) => name.replace(/ \(.*\)$/, '')));
    const unclassified = writes.filter(
      (route) => !frozen.has(route) && !ALLOWED.has(route) && !NOT_CASE_DATA.test(route),
    );
    expect(unclassified).toEqual([]);
  });

  it.each(Object.keys(REFUSED))(
    'refuses %s with 409 naming who placed the hold, and records nothing',
    async (name) => {
      const call = REFUSED[name]();
      const caseId = call.path.includes(heldSubmitted.caseId) ? heldSubmitted.caseId : held.caseId;
      const before = await auditActions(caseId);
      const res = await as(t, call.role)[call.method](call.path, call.body);
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('on_hold');
      expect(res.body.error.message).toContain(PLACED_BY);
      expect(res.body.error.message).toContain(HOLD_REASON);
      expect(await auditActions(caseId)).toEqual(before);
    },
  );

  it('keeps the case record, findings and bookmark as they were', async () => {
    const record = (await as(t, 'investigator').get(`/api/cases/${held.caseId}`)).body;
    expect(record).toMatchObject({ title: 'Dock 4 bookmark case', severity: 'medium' });
    expect(record.summary ?? '').not.toContain('rewrite');
    const findings = (await as(t, 'investigator').get(`/api/cases/${held.caseId}/findings`)).body;
    expect(findings.draft.content.summary).toBe(SAMPLE_FINDINGS.summary);
    expect(findings.canEdit).toBe(false);
    expect(findings.editBlockedReason).toContain(PLACED_BY);
    const bookmark = await as(t, 'legal').get(`/api/bookmarks/${bookmarkId}`);
    expect(bookmark.body.note).toBe(bookmarkBody(held.replayId).note);
  });

  it('allows additions under hold and records each one', async () => {
    const added = await as(t, 'investigator').post(
      `/api/cases/${held.caseId}/bookmarks`,
      bookmarkBody(held.replayId, { note: 'Added while the case is held' }),
    );
    expect(added.status).toBe(201);
    const fix = await as(t, 'engineer').post(`/api/cases/${held.caseId}/fixes`, {
      url: 'https://tracker.harbourline.example/CR-204',
      description: 'Ramp drainage added at dock 4',
    });
    expect(fix.status).toBe(201);
    const actions = await auditActions(held.caseId);
    expect(actions).toEqual(expect.arrayContaining(['bookmark.create', 'fix.link']));
  });

  it('lets the record change again once legal lifts the hold', async () => {
    const caseId = await caseWithDraft(t);
    await placeHold(caseId);
    await as(t, 'investigator')
      .patch(`/api/cases/${caseId}`, { summary: 'after' })
      .then((res) => expect(res.status).toBe(409));
    const released = await as(t, 'legal').delete(`/api/cases/${caseId}/hold`, { reason: 'Claim settled' });
    expect(released.status).toBe(200);
    const edited = await as(t, 'investigator').patch(`/api/cases/${caseId}`, { summary: 'after' });
    expect(edited.status).toBe(200);
    expect(edited.body.summary).toBe('after');
  });
});
