import { tmpdir } from 'node:os';
import path from 'node:path';
import { gt, max } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEntries } from '../../api/src/db/schema';
import type { RouteSpec } from '../../api/src/http/route-spec';
import { ROLES, type Role } from '../../shared/roles';
import { ACCESS_POLICY, isAllowedByPolicy } from '../support/access-policy';
import { archiveSamples } from '../support/archive-samples';
import { makeBundleFiles, makeTempDir, writeBundleZip } from '../support/bundle-fixtures';
import { bundleViewSamples } from '../support/bundle-view-samples';
import { caseWorkSamples } from '../support/case-work-samples';
import { evidenceSamples } from '../support/evidence-samples';
import { figureSamples } from '../support/figure-samples';
import { memberSamples } from '../support/member-samples';
import { writeMcap } from '../support/recordings/write-mcap';
import { replayToEnd } from '../support/replay-runs';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Calls every route as every role and with no session, first as members of the case the call is
 * about, then as people of each role who are not members. The expected answer comes from the
 * hand-written policy in tests/support/access-policy.ts, not from the routes' own declarations:
 * an allowed call must get a 2xx, a refused one 403, no session 401. Each route needs a valid
 * sample request below, so a new route cannot be added without joining the matrix. Each call's
 * audit entries are read back: a successful call of a route that declares an audit action leaves
 * exactly that entry (and any `case.transition` it causes), every other call leaves none.
 */
interface Sample {
  path: string;
  body?: object;
  /** Routes that end the caller's session get a fresh sign-in each call. */
  needsFreshSession?: boolean;
  /** Multipart upload: field name and file path. */
  attach?: { field: string; file: string };
  /** Text fields sent with the upload. */
  fields?: Record<string, string>;
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
const RECORDING_PROGRESS_ID = '2b7e4c1a-9f3d-4a8e-b6c2-7d1f0e5a3c98';
let recordingProgressUpload: Promise<void> | undefined;

const SAMPLES: Record<string, (f: Fixtures, role: Role | null) => Sample | Promise<Sample>> = {
  ...caseWorkSamples(() => t),
  ...archiveSamples(() => t),
  ...evidenceSamples(() => t),
  ...bundleViewSamples(),
  ...memberSamples(() => t),
  ...figureSamples(() => t),
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
  'get /cases/:id/recordings/progress/:progressId': async (f) => {
    // The demo investigator's finished upload: its progress stays readable for five minutes.
    recordingProgressUpload ??= (async () => {
      const file = await writeMcap(
        path.resolve('sample-logs/wheel-slip'),
        path.join(tmpdir(), `matrix-progress-${unique()}.mcap`),
        { compression: 'none', scanLimit: 20 },
      );
      await request(t.app)
        .post(`/api/cases/${f.caseId}/recordings`)
        .set('Authorization', `Bearer ${await t.tokenFor('investigator')}`)
        .field('progress_id', RECORDING_PROGRESS_ID)
        .attach('recording', file)
        .expect(201);
    })();
    await recordingProgressUpload;
    return { path: `/api/cases/${f.caseId}/recordings/progress/${RECORDING_PROGRESS_ID}` };
  },
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

/** Who calls: a demo account (a member of every case the samples use) or an outsider of that role. */
interface Caller {
  role: Role;
  email: string;
  password: string;
  isMember: boolean;
}

const OUTSIDER_PASSWORD = 'outsider-password-1';
const WORKING_ROLES = ['investigator', 'reviewer', 'engineer', 'legal'] as const satisfies readonly Role[];
const memberCaller = (role: Role): Caller => ({
  role,
  email: `${role}@driftcase.example`,
  password: 'driftcase-demo',
  isMember: true,
});
const outsiderCaller = (role: Role): Caller => ({
  role,
  email: `outsider-${role}@driftcase.example`,
  password: OUTSIDER_PASSWORD,
  isMember: false,
});

let t: TestApp;
let fixtures: Fixtures;
let specs: RouteSpec[];
const outsiderTokens = new Map<Role, string>();

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
  for (const role of WORKING_ROLES) {
    const outsider = outsiderCaller(role);
    await request(t.app)
      .post('/api/users')
      .set('Authorization', `Bearer ${admin}`)
      .send({ email: outsider.email, name: `Outside ${role}`, role, password: outsider.password })
      .expect(201);
    const signedIn = await request(t.app)
      .post('/api/auth/login')
      .send({ email: outsider.email, password: outsider.password })
      .expect(200);
    outsiderTokens.set(role, signedIn.body.token);
  }
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
  const earlier = new Set<string>(spec.audit.precededBy ?? []);
  const others = entries.filter(
    (entry) =>
      entry.action !== declared &&
      !earlier.has(entry.action) &&
      !(entry.action === 'case.transition' && (entry.details as { cause?: string }).cause === declared),
  );
  if (own === 1 && others.length === 0) return null;
  return `declares ${declared} but left ${actions.join(', ') || 'no entry'}`;
}

/**
 * Prepares a call (sample state, sign-in) and returns a function that sends it, so the audit
 * entries of the call itself can be told apart from those of its preparation.
 */
async function callAs(spec: RouteSpec, caller: Caller | null) {
  const role = caller?.role ?? null;
  const sample = await SAMPLES[`${spec.method} ${spec.path}`](fixtures, role);
  let req = request(t.app)[spec.method](sample.path);
  if (caller) {
    const token = sample.needsFreshSession
      ? (
          await request(t.app)
            .post('/api/auth/login')
            .send({ email: caller.email, password: caller.password })
        ).body.token
      : caller.isMember
        ? await t.tokenFor(caller.role)
        : outsiderTokens.get(caller.role);
    req = req.set('Authorization', `Bearer ${token}`);
  }
  // The role check runs before the upload is read, so callers it refuses send no file: the server
  // answers without reading the body, and a streamed file would break the pipe. Callers it lets
  // through send the file, so the membership check after it is reached.
  const isAllowed = spec.access === 'public' || (role !== null && spec.access.includes(role));
  const prepared = req;
  // Awaiting a supertest request sends it, so it is wrapped until the caller is ready.
  if (sample.attach && isAllowed)
    return () => prepared.field(sample.fields ?? {}).attach(sample.attach!.field, sample.attach!.file);
  return () => (sample.body ? prepared.send(sample.body) : prepared);
}

describe('role x route matrix', () => {
  it('has a sample request for every route', () => {
    const missing = specs.map((s) => `${s.method} ${s.path}`).filter((key) => !SAMPLES[key]);
    expect(missing).toEqual([]);
  });

  it('has a hand-written policy for every route', () => {
    const missing = specs.map((s) => `${s.method} ${s.path}`).filter((key) => !ACCESS_POLICY[key]);
    expect(missing).toEqual([]);
  });

  it('answers each role, as a member of the case, as the policy says', async () => {
    const failures: string[] = [];
    for (const spec of specs) {
      const route = `${spec.method} ${spec.path}`;
      const key = `${spec.method.toUpperCase()} ${spec.path}`;
      const isPublic = isAllowedByPolicy(route, null, true);
      const anonymousCall = await callAs(spec, null);
      let before = await lastAuditId();
      const anonymous = await anonymousCall();
      const isPublicSuccess = isPublic && anonymous.status >= 200 && anonymous.status < 300;
      const anonymousAudit = auditProblem(spec, isPublicSuccess, await auditEntriesAfter(before));
      if (anonymousAudit) failures.push(`${key} with no session: ${anonymousAudit}`);
      const expectedAnonymous = isPublic ? 'success' : 401;
      if (isPublic ? anonymous.status >= 300 : anonymous.status !== 401) {
        failures.push(`${key} with no session: got ${anonymous.status}, expected ${expectedAnonymous}`);
      }
      for (const role of ROLES) {
        const call = await callAs(spec, memberCaller(role));
        before = await lastAuditId();
        const res = await call();
        const isAllowed = isAllowedByPolicy(route, role, true);
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

  it('answers people of each role who are not members of the case as the policy says, naming the case', async () => {
    const failures: string[] = [];
    for (const spec of specs) {
      const route = `${spec.method} ${spec.path}`;
      if (spec.access === 'public') continue;
      for (const role of WORKING_ROLES) {
        const call = await callAs(spec, outsiderCaller(role));
        const before = await lastAuditId();
        const res = await call();
        const isAllowed = isAllowedByPolicy(route, role, false);
        const isSuccess = isAllowed && res.status >= 200 && res.status < 300;
        const audited = auditProblem(spec, isSuccess, await auditEntriesAfter(before));
        const label = `${spec.method.toUpperCase()} ${spec.path} as a non-member ${role}`;
        if (audited) failures.push(`${label}: ${audited}`);
        if (isAllowed && !isSuccess) {
          failures.push(`${label}: got ${res.status} ${JSON.stringify(res.body)}, expected 2xx`);
        } else if (!isAllowed && (res.status !== 403 || res.body.error?.code !== 'forbidden')) {
          failures.push(`${label}: got ${res.status}, expected 403 forbidden`);
        } else if (
          !isAllowed &&
          spec.access.includes(role) &&
          !/case DC-\d{4}/.test(res.body.error.message)
        ) {
          // Refused by membership rather than by role: the message names the case in plain words.
          failures.push(`${label}: the refusal does not name the case: ${res.body.error.message}`);
        }
      }
    }
    expect(failures).toEqual([]);
  }, 240_000);

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
