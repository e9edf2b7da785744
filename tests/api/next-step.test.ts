import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { as, signedCase } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(() => t.close());

// Who may act is the routes' access: link a fix = engineer (api/src/routes/fixes.ts), verify =
// investigator or reviewer, close a signed case = reviewer or admin (shared/case-lifecycle.ts).
describe('the next step in GET /api/cases/:id/lifecycle', () => {
  it('names only what the caller can do, and changes once a fix waits for verification', async () => {
    const { caseId } = await signedCase(t);
    const yourMove = async (role: 'engineer' | 'investigator' | 'reviewer' | 'legal') =>
      (await as(t, role).get(`/api/cases/${caseId}/lifecycle`)).body.yourMove as string | null;

    expect(await yourMove('engineer')).toMatch(/^Link the fix/);
    expect(await yourMove('engineer')).not.toMatch(/close|verify/i);
    expect(await yourMove('reviewer')).toMatch(/Close the case/);
    expect(await yourMove('investigator')).toBeNull();
    expect(await yourMove('legal')).toBeNull();

    const fix = await as(t, 'engineer').post(`/api/cases/${caseId}/fixes`, {
      commitId: '3f9c2ab',
      description: 'Cross aisle cleared at shift end',
    });
    expect(fix.status).toBe(201);
    expect(await yourMove('engineer')).toBeNull();
    expect(await yourMove('investigator')).toMatch(/^Verify the linked fix/);
    expect(await yourMove('investigator')).not.toMatch(/close/i);
    expect(await yourMove('reviewer')).toMatch(/Verify the linked fix.*then close the case/);

    const lifecycle = (await as(t, 'engineer').get(`/api/cases/${caseId}/lifecycle`)).body;
    expect(lifecycle.nextActor.roles).toEqual(['investigator', 'reviewer']);
  });
});
