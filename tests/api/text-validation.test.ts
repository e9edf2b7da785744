import fs from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import type { RouteSpec } from '../../api/src/http/route-spec';
import { ZLoginRequest } from '../../shared/contracts/auth';
import { ZCreateBookmarkRequest, ZUpdateBookmarkRequest } from '../../shared/contracts/bookmarks';
import { ZCaseTransitionRequest } from '../../shared/contracts/case-lifecycle';
import { ZAddCaseMemberRequest } from '../../shared/contracts/case-members';
import { ZCaseListQuery, ZCreateCaseRequest, ZUpdateCaseRequest } from '../../shared/contracts/cases';
import { ZEmptyBody } from '../../shared/contracts/empty-body';
import { ZFindingsDraft, ZReturnRequest, ZSignoffRequest } from '../../shared/contracts/findings';
import { ZLinkFixRequest, ZVerifyFixRequest } from '../../shared/contracts/fixes';
import { ZPlaceHoldRequest, ZReleaseHoldRequest } from '../../shared/contracts/holds';
import { ZStartReplayRequest } from '../../shared/contracts/replays';
import { ZCreateSavedQueryRequest } from '../../shared/contracts/saved-queries';
import { ZCreateUserRequest, ZUpdateUserRequest } from '../../shared/contracts/users';
import { SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import { stringLeaves, textFieldPaths, withValueAt } from '../support/request-text-fields';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * NUL (U+0000) and a lone UTF-16 surrogate in every text field of every write route, and in the
 * case list's query string, are refused with 400 naming the field, never a 500 and never stored
 * (PostgreSQL text and jsonb refuse NUL; a lone surrogate has no UTF-8 form, RFC 3629 section 3).
 * Ids can be any UUID: a body is checked before anything is looked up.
 */
const ID = '3f9c2ab0-5d1e-4c6a-9b7f-2e8d4a6c1b90';
const SHA = 'a'.repeat(64);
const BAD_TEXT = { nul: 'bad\u0000text', 'lone surrogate': 'bad\ud800text' };

interface BodyCase {
  /** `method path` as the route declares it. */
  route: string;
  url: string;
  contract: z.ZodType;
  /** A valid body that fills every text field the contract has. */
  body: Record<string, unknown>;
}

const FULL_FINDINGS = {
  ...SAMPLE_FINDINGS,
  evidence: [
    { type: 'replay', replayId: ID, digest: 'digest-1', note: 'n' },
    { type: 'bookmark', bookmarkId: ID, note: 'n' },
    { type: 'saved_query', queryId: ID, resultSha256: SHA, note: 'n' },
    { type: 'bundle_file', bundleId: ID, file: 'odometry.csv', sha256: SHA, note: 'n' },
    { type: 'cause', replayId: ID, digest: 'digest-1', kind: 'odometry_fault', note: 'n' },
    { type: 'figure', figureId: ID, sha256: SHA, note: 'n' },
  ],
};

const BODIES: BodyCase[] = [
  {
    route: 'post /auth/login',
    url: '/api/auth/login',
    contract: ZLoginRequest,
    body: { email: 'nobody@driftcase.example', password: 'wrong-password' },
  },
  { route: 'post /auth/logout', url: '/api/auth/logout', contract: ZEmptyBody, body: {} },
  { route: 'post /keys/rotate', url: '/api/keys/rotate', contract: ZEmptyBody, body: {} },
  {
    route: 'post /users',
    url: '/api/users',
    contract: ZCreateUserRequest,
    body: {
      email: 'text@driftcase.example',
      name: 'Text Person',
      role: 'engineer',
      password: 'long-enough-password',
    },
  },
  {
    route: 'patch /users/:id',
    url: `/api/users/${ID}`,
    contract: ZUpdateUserRequest,
    body: { name: 'Renamed', role: 'engineer' },
  },
  {
    route: 'post /cases',
    url: '/api/cases',
    contract: ZCreateCaseRequest,
    body: {
      title: 'Text case',
      site: 'Yard',
      robotId: 'R-1',
      incidentTime: '2026-10-01T08:00:00Z',
      severity: 'low',
      summary: 'Summary',
    },
  },
  {
    route: 'patch /cases/:id',
    url: `/api/cases/${ID}`,
    contract: ZUpdateCaseRequest,
    body: {
      title: 'Edited title',
      site: 'Yard',
      robotId: 'R-1',
      incidentTime: '2026-10-01T08:00:00Z',
      severity: 'low',
      summary: 'silent edit',
      status: 'analysing',
    },
  },
  {
    route: 'post /cases/:id/transitions',
    url: `/api/cases/${ID}/transitions`,
    contract: ZCaseTransitionRequest,
    body: { to: 'analysing', comment: 'Starting' },
  },
  {
    route: 'put /cases/:id/findings',
    url: `/api/cases/${ID}/findings`,
    contract: ZFindingsDraft,
    body: FULL_FINDINGS,
  },
  {
    route: 'post /cases/:id/findings/submit',
    url: `/api/cases/${ID}/findings/submit`,
    contract: ZEmptyBody,
    body: {},
  },
  {
    route: 'post /cases/:id/findings/versions/:v/signoff',
    url: `/api/cases/${ID}/findings/versions/1/signoff`,
    contract: ZSignoffRequest,
    body: { acknowledgeCaution: true },
  },
  {
    route: 'post /cases/:id/findings/versions/:v/return',
    url: `/api/cases/${ID}/findings/versions/1/return`,
    contract: ZReturnRequest,
    body: { comment: 'Cite the replay' },
  },
  {
    route: 'post /cases/:id/fixes',
    url: `/api/cases/${ID}/fixes`,
    contract: ZLinkFixRequest,
    body: {
      url: 'https://tracker.example/CR-1',
      commitId: '3f9c2ab',
      description: 'Lowered the slip threshold',
      changedSettings: { slip_threshold: '0.15', nested: { list: ['a'] } },
      softwareVersion: '4.2.1',
      verificationReplayId: ID,
    },
  },
  {
    route: 'post /cases/:id/fixes',
    url: `/api/cases/${ID}/fixes`,
    contract: ZLinkFixRequest,
    body: {
      commitId: '3f9c2ab',
      description: 'Lowered the slip threshold',
      changedSettings: 'slip 0.3 -> 0.15',
    },
  },
  {
    route: 'post /cases/:id/fixes/:fixId/verify',
    url: `/api/cases/${ID}/fixes/${ID}/verify`,
    contract: ZVerifyFixRequest,
    body: { comment: 'Checked the replay' },
  },
  {
    route: 'post /cases/:id/hold',
    url: `/api/cases/${ID}/hold`,
    contract: ZPlaceHoldRequest,
    body: { reason: 'Claim' },
  },
  {
    route: 'delete /cases/:id/hold',
    url: `/api/cases/${ID}/hold`,
    contract: ZReleaseHoldRequest,
    body: { reason: 'Settled' },
  },
  {
    route: 'post /bundles/:id/replays',
    url: `/api/bundles/${ID}/replays`,
    contract: ZStartReplayRequest,
    body: { label: 'What-if', overrides: { resampling_method: 'systematic' } },
  },
  { route: 'delete /replays/:id', url: `/api/replays/${ID}`, contract: ZEmptyBody, body: {} },
  {
    route: 'post /cases/:id/members',
    url: `/api/cases/${ID}/members`,
    contract: ZAddCaseMemberRequest,
    body: { userId: ID },
  },
  {
    route: 'delete /cases/:id/members/:userId',
    url: `/api/cases/${ID}/members/${ID}`,
    contract: ZEmptyBody,
    body: {},
  },
  {
    route: 'post /cases/:id/bookmarks',
    url: `/api/cases/${ID}/bookmarks`,
    contract: ZCreateBookmarkRequest,
    body: {
      replayId: ID,
      step: 1,
      t: 0.5,
      view: { centerX: 0, centerY: 0, zoom: 10, layers: ['scan'] },
      note: 'Look',
    },
  },
  {
    route: 'patch /bookmarks/:id',
    url: `/api/bookmarks/${ID}`,
    contract: ZUpdateBookmarkRequest,
    body: { note: 'Look again' },
  },
  { route: 'delete /bookmarks/:id', url: `/api/bookmarks/${ID}`, contract: ZEmptyBody, body: {} },
  {
    route: 'post /cases/:id/queries',
    url: `/api/cases/${ID}/queries`,
    contract: ZCreateSavedQueryRequest,
    body: {
      bundleId: ID,
      title: 'Slow steps',
      sql: 'select 1',
      resultSha256: SHA,
      rowCount: 2,
      columns: ['a', 'b'],
      preview: [['text', { key: 'value' }]],
    },
  },
];

/** Uploads: multipart with a file and no text field (the file name is checked with the upload). */
const MULTIPART_ROUTES = [
  'post /cases/:id/bundles',
  'post /archives/verify',
  'post /cases/:id/recordings',
  'post /cases/:id/figures',
];
// The recording upload's text fields (from, to, incident) are checked in tests/api/recordings/recording-upload.test.ts;
// the figure's caption (safeText, like every text field) in tests/api/figures.test.ts.

let t: TestApp;
let specs: RouteSpec[];
beforeAll(async () => {
  t = await createTestApp();
  specs = t.app.locals.routeSpecs;
});
afterAll(() => t.close());

/** A session of its own, for calls that may end the one they use (sign-out). */
async function freshToken(role: string): Promise<string> {
  const res = await request(t.app)
    .post('/api/auth/login')
    .send({ email: `${role}@driftcase.example`, password: 'driftcase-demo' });
  return res.body.token;
}

async function send(route: string, url: string, body: unknown) {
  const spec = specs.find((s) => `${s.method} ${s.path}` === route);
  if (!spec) throw new Error(`no route ${route}`);
  let req = request(t.app)[spec.method](url);
  if (spec.access !== 'public') {
    const role = spec.access[0];
    const token = route === 'post /auth/logout' ? await freshToken(role) : await t.tokenFor(role);
    req = req.set('Authorization', `Bearer ${token}`);
  }
  return req.send(body as object);
}

const fieldsOf = (res: request.Response): string[] =>
  ((res.body.error?.details ?? []) as { path: string }[]).map((detail) => detail.path);

describe('text validation', () => {
  it('has a body for every write route that takes JSON', () => {
    const writes = specs.filter((s) => s.method !== 'get').map((s) => `${s.method} ${s.path}`);
    const covered = [...BODIES.map((c) => c.route), ...MULTIPART_ROUTES];
    expect(writes.filter((route) => !covered.includes(route))).toEqual([]);
  });

  it.each(BODIES)('$route: the sample body is valid', ({ contract, body }) => {
    expect(contract.safeParse(body).success).toBe(true);
  });

  it.each([...new Set(BODIES.map((c) => c.route))])(
    '%s: the samples fill every text field of the contract',
    (route) => {
      const cases = BODIES.filter((c) => c.route === route);
      const filled = new Set(
        cases.flatMap((c) =>
          stringLeaves(c.body).map((path) => path.map((p) => (typeof p === 'number' ? 0 : p)).join('.')),
        ),
      );
      const isFilled = (field: string) => {
        const freeForm = field.match(/^(.*?)\.?(\*|\{key\})/);
        if (!freeForm) return filled.has(field);
        // Inside free-form JSON any string will do; its keys are tested on their own below.
        return [...filled].some((path) => path.startsWith(`${freeForm[1]}.`));
      };
      expect(textFieldPaths(cases[0].contract).filter((field) => !isFilled(field))).toEqual([]);
    },
  );

  it.each(BODIES)(
    '$route: refuses NUL and a lone surrogate in each text field with 400 naming it',
    async (c) => {
      const valid = await send(c.route, c.url, c.body);
      expect(valid.body.error?.code, JSON.stringify(valid.body)).not.toBe('validation_failed');
      const problems: string[] = [];
      for (const leaf of stringLeaves(c.body)) {
        const field = leaf.join('.');
        for (const [kind, text] of Object.entries(BAD_TEXT)) {
          const res = await send(c.route, c.url, withValueAt(c.body, leaf, text));
          if (
            res.status !== 400 ||
            res.body.error?.code !== 'validation_failed' ||
            !fieldsOf(res).includes(field)
          ) {
            problems.push(`${kind} in ${field}: ${res.status} ${JSON.stringify(res.body)}`);
          } else if (!res.body.error.message.includes(field)) {
            problems.push(`${kind} in ${field}: the message does not name the field`);
          }
        }
      }
      expect(problems).toEqual([]);
    },
  );

  it.each(BODIES)('$route: refuses an unknown field, even one named with NUL, and names it', async (c) => {
    for (const key of ['\u0000', 'unexpected']) {
      const res = await send(c.route, c.url, { ...c.body, [key]: 1 });
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual([key === '\u0000' ? '\\u0000' : key]);
      expect(res.body.error.message).toContain('Unknown field');
    }
  });

  it('refuses NUL and lone surrogates in the keys of free-form JSON', async () => {
    for (const [route, url, body, field] of [
      [
        'post /cases/:id/fixes',
        `/api/cases/${ID}/fixes`,
        BODIES.find((c) => c.route === 'post /cases/:id/fixes')!.body,
        'changedSettings',
      ],
      [
        'post /cases/:id/queries',
        `/api/cases/${ID}/queries`,
        BODIES.find((c) => c.route === 'post /cases/:id/queries')!.body,
        'preview.0.1',
      ],
    ] as const) {
      const leaf = field.split('.').map((part) => (/^\d+$/.test(part) ? Number(part) : part));
      for (const key of ['bad\u0000key', 'bad\udc00key']) {
        const res = await send(route, url, withValueAt(body, leaf, { [key]: 'value' }));
        expect(res.status, JSON.stringify(res.body)).toBe(400);
        expect(fieldsOf(res)[0]).toMatch(
          new RegExp(`^${field.replace(/\./g, '\\.')}\\.bad\\\\u(0000|dc00)key$`),
        );
      }
    }
  });

  it('refuses an upload whose file name holds NUL, keeping nothing of it', async () => {
    const token = await t.tokenFor('investigator');
    const caseId = (await request(t.app).get('/api/cases').set('Authorization', `Bearer ${token}`)).body
      .items[0].id;
    const { incoming } = t.app.locals.services.evidence;
    const kept = () => (fs.existsSync(incoming) ? fs.readdirSync(incoming).sort() : []);
    const before = kept();
    // RFC 7578 section 4.2 / RFC 5987: a percent-encoded UTF-8 file name, here with %00 in it.
    // (A lone surrogate cannot arrive this way: its bytes are not UTF-8 and decode to U+FFFD.)
    const body = Buffer.from(
      '--XYZ\r\nContent-Disposition: form-data; name="bundle"; filename*=UTF-8\'\'dock%00four.zip\r\n' +
        'Content-Type: application/zip\r\n\r\nPK not a zip\r\n--XYZ--\r\n',
    );
    const res = await request(t.app)
      .post(`/api/cases/${caseId}/bundles`)
      .set('Authorization', `Bearer ${token}`)
      .set('Content-Type', 'multipart/form-data; boundary=XYZ')
      .send(body);
    expect(res.status, JSON.stringify(res.body)).toBe(400);
    expect(fieldsOf(res)).toEqual(['bundle']);
    expect(res.body.error.message).toContain('file name must not contain the NUL character');
    expect(kept()).toEqual(before);
  });

  it('refuses NUL in the case list query string with 400 naming the parameter', async () => {
    const token = await t.tokenFor('investigator');
    for (const name of Object.keys(ZCaseListQuery.shape).filter((key) => ['q', 'site'].includes(key))) {
      const res = await request(t.app)
        .get(`/api/cases?${name}=dock%00four`)
        .set('Authorization', `Bearer ${token}`);
      expect(res.status).toBe(400);
      expect(fieldsOf(res)).toEqual([name]);
      expect(res.body.error.message).toContain('NUL');
    }
    const fine = await request(t.app).get('/api/cases?q=dock').set('Authorization', `Bearer ${token}`);
    expect(fine.status).toBe(200);
  });
});
