import path from 'node:path';
import request from 'supertest';
import type { TCreateBookmarkRequest } from '../../shared/contracts/bookmarks';
import type { TCreateSavedQueryRequest } from '../../shared/contracts/saved-queries';
import { queryResultSha256 } from '../../shared/query-result-hash';
import { makeBundleFiles, makeTempDir, writeBundleZip } from './bundle-fixtures';
import { as, createCase } from './case-work-fixtures';
import type { TestApp } from './test-app';

interface EvidenceSample {
  path: string;
  body?: object;
}

export interface CaseWithReplay {
  caseId: string;
  bundleId: string;
  replayId: string;
  steps: number;
  digest: string;
}

function expectStatus(res: request.Response, status: number, what: string) {
  if (res.status !== status) throw new Error(`${what}: got ${res.status} ${JSON.stringify(res.body)}`);
  return res;
}

/** A fresh case with a small bundle and one finished replay of it (invented depot, robot HR-04). */
export async function caseWithReplay(t: TestApp): Promise<CaseWithReplay> {
  const caseId = await createCase(t, 'Dock 4 bookmark case');
  const zip = await writeBundleZip(
    path.join(await makeTempDir('driftcase-evidence-'), 'bundle.zip'),
    makeBundleFiles({ steps: 12 }),
  );
  const token = await t.tokenFor('investigator');
  const uploaded = await request(t.app)
    .post(`/api/cases/${caseId}/bundles`)
    .set('Authorization', `Bearer ${token}`)
    .attach('bundle', zip);
  const bundleId = expectStatus(uploaded, 201, 'upload').body.bundle.id;
  const started = await as(t, 'investigator').post(`/api/bundles/${bundleId}/replays`, {
    overrides: { particles: 50 },
  });
  const replayId = expectStatus(started, 202, 'start replay').body.id;
  for (;;) {
    const replay = (await as(t, 'investigator').get(`/api/replays/${replayId}`)).body;
    if (replay.status === 'done')
      return { caseId, bundleId, replayId, steps: replay.steps, digest: replay.digest };
    if (replay.status !== 'queued' && replay.status !== 'running')
      throw new Error(`replay ended ${replay.status}: ${replay.error}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

export function bookmarkBody(replayId: string, overrides: Partial<TCreateBookmarkRequest> = {}) {
  return {
    replayId,
    step: 3,
    t: 0.3,
    view: { centerX: 4.2, centerY: -1.5, zoom: 40, followRobot: true, layers: ['particles', 'scan'] },
    note: 'Belief splits here, just before the rack corner.',
    ...overrides,
  } satisfies TCreateBookmarkRequest;
}

/** A whole small result, sent as its own preview so the server can check the hash. */
export function savedQueryBody(bundleId: string, overrides: Partial<TCreateSavedQueryRequest> = {}) {
  const columns = ['kind', 'events'];
  const preview = [
    ['contact', 1],
    ['protective_stop', 2],
  ];
  return {
    bundleId,
    title: 'Events per kind',
    sql: 'SELECT kind, count(*) AS events FROM events GROUP BY kind ORDER BY kind',
    resultSha256: queryResultSha256(columns, preview),
    rowCount: preview.length,
    columns,
    preview,
    ...overrides,
  } satisfies TCreateSavedQueryRequest;
}

export async function createBookmark(t: TestApp, caseId: string, replayId: string): Promise<string> {
  const res = await as(t, 'investigator').post(`/api/cases/${caseId}/bookmarks`, bookmarkBody(replayId));
  return expectStatus(res, 201, 'create bookmark').body.id;
}

/**
 * Role-matrix samples for the bookmark and saved-query routes, over the matrix's case and its
 * finished replay. Deletes get a fresh bookmark per call, so each role meets the same situation.
 */
export function evidenceSamples(
  app: () => TestApp,
): Record<
  string,
  (f: { caseId: string; bundleId: string; replayId: string }) => Promise<EvidenceSample> | EvidenceSample
> {
  let shared: Promise<string> | undefined;
  const sharedBookmark = (f: { caseId: string; replayId: string }) =>
    (shared ??= createBookmark(app(), f.caseId, f.replayId));
  let savedQuery: Promise<string> | undefined;
  const sharedQuery = (f: { caseId: string; bundleId: string }) =>
    (savedQuery ??= as(app(), 'investigator')
      .post(`/api/cases/${f.caseId}/queries`, savedQueryBody(f.bundleId))
      .then((res) => expectStatus(res, 201, 'save query').body.id));
  return {
    'get /cases/:id/bookmarks': (f) => ({ path: `/api/cases/${f.caseId}/bookmarks` }),
    'post /cases/:id/bookmarks': (f) => ({
      path: `/api/cases/${f.caseId}/bookmarks`,
      body: bookmarkBody(f.replayId),
    }),
    'get /bookmarks/:id': async (f) => ({ path: `/api/bookmarks/${await sharedBookmark(f)}` }),
    'patch /bookmarks/:id': async (f) => ({
      path: `/api/bookmarks/${await sharedBookmark(f)}`,
      body: { note: 'Belief splits here; scans disagree with the map.' },
    }),
    'delete /bookmarks/:id': async (f) => ({
      path: `/api/bookmarks/${await createBookmark(app(), f.caseId, f.replayId)}`,
    }),
    'get /cases/:id/queries': (f) => ({ path: `/api/cases/${f.caseId}/queries` }),
    'post /cases/:id/queries': (f) => ({
      path: `/api/cases/${f.caseId}/queries`,
      body: savedQueryBody(f.bundleId),
    }),
    'get /queries/:id': async (f) => ({ path: `/api/queries/${await sharedQuery(f)}` }),
  };
}
