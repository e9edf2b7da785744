import { tmpdir } from 'node:os';
import path from 'node:path';
import { gt, max } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEntries } from '../../api/src/db/schema';
import type { RouteSpec } from '../../api/src/http/route-spec';
import { ROLES, type Role } from '../../shared/roles';
import { archiveSamples } from '../support/archive-samples';
import { makeBundleFiles, makeTempDir, writeBundleZip } from '../support/bundle-fixtures';
import { bundleViewSamples } from '../support/bundle-view-samples';
import { caseWorkSamples } from '../support/case-work-samples';
import { evidenceSamples } from '../support/evidence-samples';
import { writeMcap } from '../support/recordings/write-mcap';
import { replayToEnd } from '../support/replay-runs';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Calls every route as every role and with no session. A role the route names must get a 2xx,
 * any other role 403, no session 401. Each route needs a valid sample request below, so a new
 * route cannot be added without joining the matrix. Each call's audit entries are read back: a
 * successful call of a route that declares an audit action leaves exactly that entry (and any
 * `case.transition` it causes), every other call leaves none.
 */
interface Sample {
  path: string;
  body?: object;
  /** Routes that end the caller's session get a fresh sign-in each call. */
  needsFreshSession?: boolean;
  /** Multipart upload: field name and file path. */
  attach?: { field: string; file: string };
}

interface Fixtures {
  caseId: string;
  userId: string;
  bundleId: string;
  /** A finished replay of `bundleId`. */
  replayId: string;
  /** Starts a replay long enough to still be running when the next request arrives. */
  startLongReplay: () => Promise<string>;
  /** A valid bundle zip; each upload sends fresh bytes so it is never a duplicate. */
  freshBundleZip: () => Promise<string>;
}

let uniqueCounter = 0;
const unique = () => `${Date.now()}-${uniqueCounter++}`;

const SAMPLES: Record<string, (f: Fixtures, role: Role | null) => Sample | Promise<Sample>> = {
  ...caseWorkSamples(() => t),
  ...archiveSamples(() => t),
  ...evidenceSamples(() => t),
  ...bundleViewSamples(),
  'get /health': () => ({ path: '/api/health' }),
  'get /site': () => ({ path: '/api/site' }),
  'post /auth/login': () => ({
    path: '/api/auth/login',
    body: { email: 'legal@driftcase.example', password: 'driftcase-demo' },
  }),
  'post /auth/logout': () => ({ path: '/api/auth/logout', needsFreshSession: true }),
  'get /auth/me': () => ({ path: '/api/auth/me' }),
  'get /users': () => ({ path: '/api/users' }),
  'post /users': () => ({
    path: '/api/users',
    body: {
      email: `new-${unique()}@driftcase.example`,
      name: 'New Person',
      role: 'engineer',
      password: 'long-enough-password',
    },
  }),
  'patch /users/:id': (f) => ({ path: `/api/users/${f.userId}`, body: { name: `Renamed ${unique()}` } }),
  'get /cases': () => ({ path: '/api/cases' }),
  'post /cases': () => ({
    path: '/api/cases',
    body: {
      title: 'Matrix case',
      site: 'Yard',
      robotId: 'R-9',
      incidentTime: '2026-10-01T08:00:00Z',
      severity: 'low',
    },
  }),
  'get /cases/:id': (f) => ({ path: `/api/cases/${f.caseId}` }),
  'patch /cases/:id': (f) => ({ path: `/api/cases/${f.caseId}`, body: { summary: `Updated ${unique()}` } }),
  'post /cases/:id/bundles': async (f) => ({
    path: `/api/cases/${f.caseId}/bundles`,
    attach: { field: 'bundle', file: await f.freshBundleZip() },
  }),
  'post /cases/:id/recordings': async (f) => ({
    path: `/api/cases/${f.caseId}/recordings`,
    attach: {
      field: 'recording',
      file: await writeMcap(
        path.resolve('sample-logs/wheel-slip'),
        path.join(tmpdir(), `matrix-${unique()}.mcap`),
        {
          compression: 'none',
          scanLimit: 20,
        },
      ),
    },
  }),
  'get /cases/:id/bundles': (f) => ({ path: `/api/cases/${f.caseId}/bundles` }),
  'get /bundles/:id': (f) => ({ path: `/api/bundles/${f.bundleId}` }),
  'get /bundles/:id/tables/:name': (f) => ({ path: `/api/bundles/${f.bundleId}/tables/odometry` }),
  'get /bundles/:id/original': (f) => ({ path: `/api/bundles/${f.bundleId}/original` }),
  'post /bundles/:id/replays': (f) => ({
    path: `/api/bundles/${f.bundleId}/replays`,
    body: { overrides: { particles: 50 } },
  }),
  'get /bundles/:id/replays': (f) => ({ path: `/api/bundles/${f.bundleId}/replays` }),
  'get /replays/:id': (f) => ({ path: `/api/replays/${f.replayId}` }),
  'delete /replays/:id': async (f) => ({ path: `/api/replays/${await f.startLongReplay()}` }),
  'get /replays/:id/progress': (f) => ({ path: `/api/replays/${f.replayId}/progress` }),
  'get /replays/:id/series': (f) => ({ path: `/api/replays/${f.replayId}/series` }),
  'get /replays/:id/steps/:k': (f) => ({ path: `/api/replays/${f.replayId}/steps/3` }),
  'get /replays/:id/disagreement': (f) => ({ path: `/api/replays/${f.replayId}/disagreement` }),
};

let t: TestApp;
let fixtures: Fixtures;
let specs: RouteSpec[];

beforeAll(async () => {
  // Refused cancel calls leave their long replays running, all started by one investigator.
  t = await createTestApp({ MAX_RUNNING_REPLAYS_PER_USER: '100' });
  specs = t.app.locals.routeSpecs;
  const admin = await t.tokenFor('admin');
  const users = await request(t.app).get('/api/users').set('Authorization', `Bearer ${admin}`);
  const cases = await request(t.app).get('/api/cases').set('Authorization', `Bearer ${admin}`);
  const zipDir = await makeTempDir('driftcase-matrix-');
  let zipCount = 0;
  const freshBundleZip = () =>
    writeBundleZip(path.join(zipDir, `b${zipCount}.zip`), makeBundleFiles({ steps: 10 + zipCount++ }));
  const caseId = cases.body.items[0].id;
  const investigator = await t.tokenFor('investigator');
  const uploaded = await request(t.app)
    .post(`/api/cases/${caseId}/bundles`)
    .set('Authorization', `Bearer ${investigator}`)
    .attach('bundle', await freshBundleZip());
  const bundleId = uploaded.body.bundle.id;
  const finished = await replayToEnd(t.app, investigator, bundleId);
  const longZip = await writeBundleZip(
    path.join(zipDir, 'long.zip'),
    makeBundleFiles({ steps: 2000, beams: 21 }),
  );
  const longBundle = await request(t.app)
    .post(`/api/cases/${caseId}/bundles`)
    .set('Authorization', `Bearer ${investigator}`)
    .attach('bundle', longZip);
  const startLongReplay = async () => {
    const res = await request(t.app)
      .post(`/api/bundles/${longBundle.body.bundle.id}/replays`)
      .set('Authorization', `Bearer ${investigator}`)
      .send({ overrides: { particles: 20000, seed: uniqueCounter++ } });
    return res.body.id as string;
  };
  fixtures = {
    userId: users.body.items.find((u: { role: string }) => u.role === 'engineer').id,
    caseId,
    bundleId,
    replayId: finished.id,
    startLongReplay,
    freshBundleZip,
  };
});
afterAll(() => t.close());

async function lastAuditId(): Promise<number> {
  const [row] = await t.database.db.select({ last: max(auditEntries.id) }).from(auditEntries);
  return row?.last ?? 0;
}

async function auditEntriesAfter(id: number) {
  return t.database.db
    .select({ action: auditEntries.action, details: auditEntries.details })
    .from(auditEntries)
    .where(gt(auditEntries.id, id))
    .orderBy(auditEntries.id);
}

/** What is wrong with the entries one call left, or null. */
function auditProblem(spec: RouteSpec, isSuccess: boolean, entries: { action: string; details: unknown }[]) {
  const actions = entries.map((entry) => entry.action);
  if (!isSuccess || !spec.audit) return actions.length ? `left entries ${actions.join(', ')}` : null;
  const declared = spec.audit.action;
  const own = actions.filter((action) => action === declared).length;
  const others = entries.filter(
    (entry) =>
      entry.action !== declared &&
      !(entry.action === 'case.transition' && (entry.details as { cause?: string }).cause === declared),
  );
  if (own === 1 && others.length === 0) return null;
  return `declares ${declared} but left ${actions.join(', ') || 'no entry'}`;
}

/**
 * Prepares a call (sample state, sign-in) and returns a function that sends it, so the audit
 * entries of the call itself can be told apart from those of its preparation.
 */
async function callAs(spec: RouteSpec, role: Role | null) {
  const sample = await SAMPLES[`${spec.method} ${spec.path}`](fixtures, role);
  let req = request(t.app)[spec.method](sample.path);
  if (role) {
    const token = sample.needsFreshSession
      ? (
          await request(t.app)
            .post('/api/auth/login')
            .send({ email: `${role}@driftcase.example`, password: 'driftcase-demo' })
        ).body.token
      : await t.tokenFor(role);
    req = req.set('Authorization', `Bearer ${token}`);
  }
  // The access check runs before the upload is read, so refused callers send no file: the server
  // answers without reading the body, and a streamed file would break the pipe.
  const isAllowed = spec.access === 'public' || (role !== null && spec.access.includes(role));
  const prepared = req;
  // Awaiting a supertest request sends it, so it is wrapped until the caller is ready.
  if (sample.attach && isAllowed) return () => prepared.attach(sample.attach!.field, sample.attach!.file);
  return () => (sample.body ? prepared.send(sample.body) : prepared);
}

describe('role x route matrix', () => {
  it('has a sample request for every route', () => {
    const missing = specs.map((s) => `${s.method} ${s.path}`).filter((key) => !SAMPLES[key]);
    expect(missing).toEqual([]);
  });

  it('answers each role as the route declares', async () => {
    const failures: string[] = [];
    for (const spec of specs) {
      const key = `${spec.method.toUpperCase()} ${spec.path}`;
      const anonymousCall = await callAs(spec, null);
      let before = await lastAuditId();
      const anonymous = await anonymousCall();
      const isPublicSuccess = spec.access === 'public' && anonymous.status >= 200 && anonymous.status < 300;
      const anonymousAudit = auditProblem(spec, isPublicSuccess, await auditEntriesAfter(before));
      if (anonymousAudit) failures.push(`${key} with no session: ${anonymousAudit}`);
      const expectedAnonymous = spec.access === 'public' ? 'success' : 401;
      if (spec.access === 'public' ? anonymous.status >= 300 : anonymous.status !== 401) {
        failures.push(`${key} with no session: got ${anonymous.status}, expected ${expectedAnonymous}`);
      }
      for (const role of ROLES) {
        const call = await callAs(spec, role);
        before = await lastAuditId();
        const res = await call();
        const isAllowed = spec.access === 'public' || spec.access.includes(role);
        const isSuccess = isAllowed && res.status >= 200 && res.status < 300;
        const audited = auditProblem(spec, isSuccess, await auditEntriesAfter(before));
        if (audited) failures.push(`${key} as ${role}: ${audited}`);
        if (isAllowed && (res.status < 200 || res.status >= 300)) {
          failures.push(`${key} as ${role}: got ${res.status} ${JSON.stringify(res.body)}, expected 2xx`);
        }
        if (!isAllowed && (res.status !== 403 || res.body.error?.code !== 'forbidden')) {
          failures.push(`${key} as ${role}: got ${res.status}, expected 403 forbidden`);
        }
      }
    }
    expect(failures).toEqual([]);
  }, 240_000); // about 800 calls; the shared 2-core machine can take minutes under load

  it('declares an audit action on every write route (the matrix above checks each one is written)', () => {
    const unaudited = specs.filter((s) => s.method !== 'get' && !s.audit).map((s) => `${s.method} ${s.path}`);
    expect(unaudited).toEqual([]);
  });

  it('names the allowed roles in the 403 message', async () => {
    const token = await t.tokenFor('engineer');
    const res = await request(t.app).get('/api/users').set('Authorization', `Bearer ${token}`).expect(403);
    expect(res.body.error.message).toContain('admin');
  });
});
