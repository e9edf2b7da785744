import { demoActor } from './case-members';
import { createCase } from './case-work-fixtures';
import type { TestApp } from './test-app';

interface MemberSample {
  path: string;
  body?: object;
}

/**
 * Role-matrix samples for the membership routes. Adding and removing each get a fresh case (the
 * demo investigator's) so every caller meets the same situation: the demo reviewer not yet on the
 * case, or on it and about to be removed.
 */
export function memberSamples(
  app: () => TestApp,
): Record<string, (f: { caseId: string }) => Promise<MemberSample> | MemberSample> {
  return {
    'get /cases/:id/members': (f) => ({ path: `/api/cases/${f.caseId}/members` }),
    'get /cases/:id/member-candidates': (f) => ({ path: `/api/cases/${f.caseId}/member-candidates` }),
    'post /cases/:id/members': async () => {
      const caseId = await createCase(app(), 'Matrix membership', { team: [] });
      return {
        path: `/api/cases/${caseId}/members`,
        body: { userId: (await demoActor(app(), 'reviewer')).id },
      };
    },
    'delete /cases/:id/members/:userId': async () => {
      const caseId = await createCase(app(), 'Matrix membership', { team: ['reviewer'] });
      return { path: `/api/cases/${caseId}/members/${(await demoActor(app(), 'reviewer')).id}` };
    },
  };
}
