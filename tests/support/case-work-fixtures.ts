import request from 'supertest';
import type { TFindingsDraft } from '../../shared/contracts/findings';
import type { Role } from '../../shared/roles';
import { addDemoMembers, DEMO_TEAM } from './case-members';
import type { TestApp } from './test-app';

/** A complete, invented set of findings (Harbourline yard, robot HL-07). */
export const SAMPLE_FINDINGS: TFindingsDraft = {
  summary: 'HL-07 lost its position near dock 4 after a wheel slipped on a wet ramp and touched a pallet.',
  incidentClass: 'property_damage',
  rootCause: {
    category: 'odometry_fault',
    text: 'Wheel slip on the wet ramp inflated the odometry by 0.4 m.',
  },
  contributingFactors: [{ category: 'environment', text: 'Ramp surface was wet after cleaning.' }],
  // Submitting checks that cited bookmarks and saved queries exist on the case; tests that need
  // citations make them first (tests/support/evidence-samples.ts).
  evidence: [],
  correctiveActions: [
    { description: 'Raise slip detection threshold', owner: 'Emeka Lindqvist', dueDate: '2026-12-15' },
  ],
};

export function as(t: TestApp, role: Role) {
  // The token is fetched first: awaiting a supertest request would send it.
  const call = async (method: 'get' | 'post' | 'put' | 'patch' | 'delete', path: string, body?: object) => {
    const token = await t.tokenFor(role);
    const req = request(t.app)[method](path).set('Authorization', `Bearer ${token}`);
    return body ? req.send(body) : req;
  };
  return {
    get: (path: string) => call('get', path),
    post: (path: string, body: object = {}) => call('post', path, body),
    put: (path: string, body: object = {}) => call('put', path, body),
    patch: (path: string, body: object = {}) => call('patch', path, body),
    delete: (path: string, body: object = {}) => call('delete', path, body),
  };
}

function expectStatus(res: request.Response, status: number, what: string) {
  if (res.status !== status) throw new Error(`${what}: got ${res.status} ${JSON.stringify(res.body)}`);
  return res;
}

/**
 * A case opened by the demo investigator, who then adds `team` (by default the demo reviewer,
 * engineer and legal) as members, as its creator would before handing work on.
 */
/** A new account made by the demo admin, as on the users page; returns the created person. */
export async function createPerson(
  t: TestApp,
  person: { email: string; name: string; role: Role; password: string },
): Promise<{ id: string; email: string }> {
  return expectStatus(await as(t, 'admin').post('/api/users', person), 201, 'create person').body;
}

export async function createCase(
  t: TestApp,
  title = 'Dock 4 contact',
  { team = DEMO_TEAM }: { team?: readonly Role[] } = {},
): Promise<string> {
  const res = await as(t, 'investigator').post('/api/cases', {
    title,
    site: 'Harbourline yard',
    robotId: 'HL-07',
    incidentTime: '2026-10-03T06:41:00Z',
    severity: 'medium',
  });
  const caseId = expectStatus(res, 201, 'create case').body.id;
  await addDemoMembers(t, caseId, team);
  return caseId;
}

export async function caseWithDraft(
  t: TestApp,
  content: TFindingsDraft = SAMPLE_FINDINGS,
  options: { team?: readonly Role[] } = {},
): Promise<string> {
  const caseId = await createCase(t, undefined, options);
  expectStatus(await as(t, 'investigator').put(`/api/cases/${caseId}/findings`, content), 200, 'save draft');
  return caseId;
}

export async function submittedCase(t: TestApp): Promise<{ caseId: string; version: number }> {
  const caseId = await caseWithDraft(t);
  const res = expectStatus(
    await as(t, 'investigator').post(`/api/cases/${caseId}/findings/submit`),
    201,
    'submit',
  );
  return { caseId, version: res.body.version };
}

export async function signedCase(t: TestApp): Promise<{ caseId: string; version: number }> {
  const submitted = await submittedCase(t);
  const path = `/api/cases/${submitted.caseId}/findings/versions/${submitted.version}/signoff`;
  expectStatus(await as(t, 'reviewer').post(path, { acknowledgeCaution: true }), 201, 'sign');
  return submitted;
}

export async function heldCase(t: TestApp): Promise<string> {
  const caseId = await createCase(t);
  expectStatus(
    await as(t, 'legal').post(`/api/cases/${caseId}/hold`, { reason: 'Insurer claim pending' }),
    201,
    'hold',
  );
  return caseId;
}

export async function caseWithFix(t: TestApp): Promise<{ caseId: string; fixId: string }> {
  const caseId = await createCase(t);
  const res = await as(t, 'engineer').post(`/api/cases/${caseId}/fixes`, {
    url: 'https://tracker.harbourline.example/CR-118',
    description: 'Slip detection threshold lowered from 0.3 to 0.15',
  });
  return { caseId, fixId: expectStatus(res, 201, 'link fix').body.id };
}
