import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditEntries } from '../../api/src/db/schema';
import { demoActor } from '../support/case-members';
import { as, createCase, createPerson, SAMPLE_FINDINGS } from '../support/case-work-fixtures';
import { createTestApp, type TestApp } from '../support/test-app';

/**
 * Case membership (README, "Roles"): everyone signed in sees that a case exists; only its members
 * and admins see its evidence and findings or change it; its creator or an admin picks its members.
 */
let t: TestApp;
/** A second investigator, who has not been put on any case. */
let outsider: { id: string; token: string };

beforeAll(async () => {
  t = await createTestApp();
  const created = await createPerson(t, {
    email: 'second-investigator@driftcase.example',
    name: 'Noor Haddad',
    role: 'investigator',
    password: 'second-investigator-pw',
  });
  const signedIn = await request(t.app)
    .post('/api/auth/login')
    .send({ email: 'second-investigator@driftcase.example', password: 'second-investigator-pw' })
    .expect(200);
  outsider = { id: created.id, token: signedIn.body.token };
});
afterAll(() => t.close());

const asOutsider = (method: 'get' | 'patch' | 'put', path: string, body?: object) => {
  const req = request(t.app)[method](path).set('Authorization', `Bearer ${outsider.token}`);
  return body ? req.send(body) : req;
};

describe('case membership', () => {
  it('makes the creator a member who manages the case', async () => {
    const caseId = await createCase(t, 'Creator is a member', { team: [] });
    const res = await as(t, 'investigator').get(`/api/cases/${caseId}/members`);
    expect(res.status).toBe(200);
    expect(res.body.canManage).toBe(true);
    expect(res.body.items).toEqual([
      expect.objectContaining({
        email: 'investigator@driftcase.example',
        role: 'investigator',
        isCreator: true,
      }),
    ]);
  });

  it('shows a non-member that the case exists but refuses its evidence, findings and edits, naming the case', async () => {
    const caseId = await createCase(t, 'Pallet jack near miss', { team: [] });
    const listed = await asOutsider('get', '/api/cases?pageSize=100');
    expect(listed.body.items.map((c: { id: string }) => c.id)).toContain(caseId);
    const record = await asOutsider('get', `/api/cases/${caseId}`);
    expect(record.status).toBe(200);
    expect(record.body.title).toBe('Pallet jack near miss');
    expect(record.body.status).toBe('open');

    for (const path of ['bundles', 'findings', 'bookmarks', 'queries', 'fixes', 'hold', 'lifecycle']) {
      const res = await asOutsider('get', `/api/cases/${caseId}/${path}`);
      expect(res.status, path).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
      expect(res.body.error.message).toContain(`case ${record.body.reference} ("Pallet jack near miss")`);
      expect(res.body.error.message).toContain('Ask the case');
    }
    const edit = await asOutsider('patch', `/api/cases/${caseId}`, { summary: 'Not mine to write' });
    expect(edit.status).toBe(403);
    const draft = await asOutsider('put', `/api/cases/${caseId}/findings`, SAMPLE_FINDINGS);
    expect(draft.status).toBe(403);
    const after = await as(t, 'investigator').get(`/api/cases/${caseId}`);
    expect(after.body.summary).toBe('');
  });

  it('lets the creator add a person, who then sees and edits the case, and audits the addition', async () => {
    const caseId = await createCase(t, 'Shared case', { team: [] });
    const added = await as(t, 'investigator').post(`/api/cases/${caseId}/members`, { userId: outsider.id });
    expect(added.status).toBe(201);
    expect(added.body.items.map((m: { userId: string }) => m.userId)).toContain(outsider.id);

    expect((await asOutsider('get', `/api/cases/${caseId}/findings`)).status).toBe(200);
    expect((await asOutsider('get', `/api/cases/${caseId}/bundles`)).status).toBe(200);
    const edit = await asOutsider('patch', `/api/cases/${caseId}`, { summary: 'Written by a member' });
    expect(edit.status).toBe(200);
    expect(edit.body.summary).toBe('Written by a member');

    const entries = await t.database.db
      .select()
      .from(auditEntries)
      .where(and(eq(auditEntries.caseId, caseId), eq(auditEntries.action, 'case.member_add')));
    expect(entries).toHaveLength(1);
    expect(entries[0].details).toEqual({ userId: outsider.id, role: 'investigator' });
    const investigator = await demoActor(t, 'investigator');
    expect(entries[0].actorId).toBe(investigator.id);
  });

  it('lets only the creator or an admin change the members; the creator cannot be removed', async () => {
    const caseId = await createCase(t, 'Managed case', { team: ['reviewer'] });
    const engineer = await demoActor(t, 'engineer');
    // A fellow investigator on the case works on it but does not choose who else does.
    await as(t, 'investigator').post(`/api/cases/${caseId}/members`, { userId: outsider.id });
    const byMember = await request(t.app)
      .post(`/api/cases/${caseId}/members`)
      .set('Authorization', `Bearer ${outsider.token}`)
      .send({ userId: engineer.id });
    expect(byMember.status).toBe(403);
    expect(byMember.body.error.message).toContain('Only the creator of case');

    const byAdmin = await as(t, 'admin').post(`/api/cases/${caseId}/members`, { userId: engineer.id });
    expect(byAdmin.status).toBe(201);
    const removed = await as(t, 'admin').delete(`/api/cases/${caseId}/members/${engineer.id}`);
    expect(removed.status).toBe(200);
    expect(removed.body.items.map((m: { userId: string }) => m.userId)).not.toContain(engineer.id);
    expect((await as(t, 'engineer').get(`/api/cases/${caseId}/findings`)).status).toBe(403);

    const investigator = await demoActor(t, 'investigator');
    const creator = await as(t, 'admin').delete(`/api/cases/${caseId}/members/${investigator.id}`);
    expect(creator.status).toBe(409);
    const twice = await as(t, 'investigator').post(`/api/cases/${caseId}/members`, {
      userId: (await demoActor(t, 'reviewer')).id,
    });
    expect(twice.status).toBe(409);
    const admin = await demoActor(t, 'admin');
    const adminMember = await as(t, 'investigator').post(`/api/cases/${caseId}/members`, {
      userId: admin.id,
    });
    expect(adminMember.status).toBe(400);
    expect(adminMember.body.error.message).toContain('administrators see every case');
  });

  it('lets an admin see any case without being a member', async () => {
    const caseId = await createCase(t, 'Admin oversight', { team: [] });
    expect((await as(t, 'admin').get(`/api/cases/${caseId}/findings`)).status).toBe(200);
    expect((await as(t, 'admin').get(`/api/cases/${caseId}/members`)).body.canWork).toBe(true);
  });

  it('offers the creator the active people not yet on the case, and refuses the list to others', async () => {
    const caseId = await createCase(t, 'Picker case', { team: ['legal'] });
    const res = await as(t, 'investigator').get(`/api/cases/${caseId}/member-candidates`);
    expect(res.status).toBe(200);
    const names = res.body.items.map((c: { name: string }) => c.name);
    expect(names).toContain('Noor Haddad');
    expect(names).not.toContain('Leah Marchetti'); // already a member
    expect(names).not.toContain('Ines Okafor'); // the creator
    expect(names).not.toContain('Ada Brennan'); // an admin
    expect((await as(t, 'legal').get(`/api/cases/${caseId}/member-candidates`)).status).toBe(403);
  });
});
