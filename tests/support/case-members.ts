import request from 'supertest';
import type { Actor } from '../../api/src/services/actor';
import type { Role } from '../../shared/roles';
import type { TestApp } from './test-app';

/** The seeded account of a role as a service-level actor, for tests that call services directly. */
export async function demoActor(t: TestApp, role: Role): Promise<Actor> {
  const person = (await t.app.locals.services.users.listUsers()).find(
    (user) => user.email === `${role}@driftcase.example`,
  );
  if (!person) throw new Error(`no demo ${role}`);
  return { id: person.id, email: person.email, role: person.role };
}

/**
 * Adds the demo accounts of `roles` to a case the way a person does: the case's creator (by
 * default the demo investigator) picks them on the members panel, which posts each one.
 */
export async function addDemoMembers(
  t: TestApp,
  caseId: string,
  roles: readonly Role[],
  { by = 'investigator' }: { by?: Role } = {},
): Promise<void> {
  const token = await t.tokenFor(by);
  for (const role of roles) {
    const { id: userId } = await demoActor(t, role);
    const res = await request(t.app)
      .post(`/api/cases/${caseId}/members`)
      .set('Authorization', `Bearer ${token}`)
      .send({ userId });
    if (res.status !== 201)
      throw new Error(`add ${role} to case: got ${res.status} ${JSON.stringify(res.body)}`);
  }
}

/** The roles besides the creator that work on a case: reviewer, engineer and legal. */
export const DEMO_TEAM: readonly Role[] = ['reviewer', 'engineer', 'legal'];
