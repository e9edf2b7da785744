import type { Role } from '../../shared/roles';
import {
  caseWithDraft,
  caseWithFix,
  createCase,
  heldCase,
  SAMPLE_FINDINGS,
  signedCase,
  submittedCase,
} from './case-work-fixtures';
import type { TestApp } from './test-app';

interface CaseWorkSample {
  path: string;
  body?: object;
}

let counter = 0;

/**
 * Role-matrix samples for the case-work routes. Routes whose success depends on state (sign-off,
 * release a hold, ...) prepare fresh state on every call, so each role meets the same situation.
 */
export function caseWorkSamples(
  app: () => TestApp,
): Record<string, (f: { caseId: string }, role?: Role | null) => CaseWorkSample | Promise<CaseWorkSample>> {
  let reviewed: Promise<{ caseId: string; version: number }> | undefined;
  const reviewedCase = async () => {
    reviewed ??= submittedCase(app());
    return (await reviewed).caseId;
  };
  return {
    'get /cases/:id/lifecycle': (f) => ({ path: `/api/cases/${f.caseId}/lifecycle` }),
    'post /cases/:id/transitions': async (_f, role) =>
      role === 'reviewer'
        ? { path: `/api/cases/${(await signedCase(app())).caseId}/transitions`, body: { to: 'closed' } }
        : { path: `/api/cases/${await createCase(app())}/transitions`, body: { to: 'analysing' } },
    'get /cases/:id/findings': (f) => ({ path: `/api/cases/${f.caseId}/findings` }),
    'get /cases/:id/evidence-names': (f) => ({ path: `/api/cases/${f.caseId}/evidence-names` }),
    'put /cases/:id/findings': async () => ({
      path: `/api/cases/${await createCase(app())}/findings`,
      body: SAMPLE_FINDINGS,
    }),
    'post /cases/:id/findings/submit': async () => ({
      path: `/api/cases/${await caseWithDraft(app())}/findings/submit`,
    }),
    'get /cases/:id/findings/versions': async () => ({
      path: `/api/cases/${await reviewedCase()}/findings/versions`,
    }),
    'get /cases/:id/findings/versions/:v': async () => ({
      path: `/api/cases/${await reviewedCase()}/findings/versions/1`,
    }),
    'get /cases/:id/findings/versions/:v/diff': async () => ({
      path: `/api/cases/${await reviewedCase()}/findings/versions/1/diff`,
    }),
    'post /cases/:id/findings/versions/:v/signoff': async () => {
      const { caseId, version } = await submittedCase(app());
      return {
        path: `/api/cases/${caseId}/findings/versions/${version}/signoff`,
        body: { acknowledgeCaution: true },
      };
    },
    'post /cases/:id/findings/versions/:v/return': async () => {
      const { caseId, version } = await submittedCase(app());
      return {
        path: `/api/cases/${caseId}/findings/versions/${version}/return`,
        body: { comment: 'Cite the replay.' },
      };
    },
    'get /cases/:id/fixes': (f) => ({ path: `/api/cases/${f.caseId}/fixes` }),
    'post /cases/:id/fixes': (f) => ({
      path: `/api/cases/${f.caseId}/fixes`,
      body: { commitId: '3f9c2ab', description: `Matrix fix ${counter++}` },
    }),
    'post /cases/:id/fixes/:fixId/verify': async () => {
      const { caseId, fixId } = await caseWithFix(app());
      return {
        path: `/api/cases/${caseId}/fixes/${fixId}/verify`,
        // The sample fix has no verification replay, so verifying it needs the confirmation.
        body: { comment: 'Checked on site', confirmWithoutImprovement: true },
      };
    },
    'get /cases/:id/hold': (f) => ({ path: `/api/cases/${f.caseId}/hold` }),
    'post /cases/:id/hold': async () => ({
      path: `/api/cases/${await createCase(app())}/hold`,
      body: { reason: 'Claim notice' },
    }),
    'delete /cases/:id/hold': async () => ({
      path: `/api/cases/${await heldCase(app())}/hold`,
      body: { reason: 'Settled' },
    }),
    'get /cases/:id/audit': (f) => ({ path: `/api/cases/${f.caseId}/audit` }),
    'get /cases/:id/audit/verify': (f) => ({ path: `/api/cases/${f.caseId}/audit/verify` }),
    'get /audit': () => ({ path: '/api/audit' }),
    'get /audit/verify': () => ({ path: '/api/audit/verify' }),
    'get /keys': () => ({ path: '/api/keys' }),
    'get /keys/thumbprints': () => ({ path: '/api/keys/thumbprints' }),
    'post /keys/rotate': () => ({ path: '/api/keys/rotate', body: {} }),
    'get /outbox': () => ({ path: '/api/outbox' }),
    'get /evidence/orphans': () => ({ path: '/api/evidence/orphans' }),
  };
}
