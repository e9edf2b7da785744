import { describe, expect, it } from 'vitest';
import { CASE_TRANSITIONS } from '../../shared/case-lifecycle';
import { CASE_STATUSES } from '../../shared/contracts/cases';
import { nextStepFor } from '../../shared/next-step';
import { ROLES, type Role } from '../../shared/roles';

/**
 * Who may do what, written out from the API's route access (api/src/routes/fixes.ts) and the
 * lifecycle table, independently of the wording under test: link a fix = engineer; verify a fix
 * = investigator or reviewer; close a signed case = reviewer or admin.
 */
const MAY_LINK: Role[] = ['engineer'];
const MAY_VERIFY: Role[] = ['investigator', 'reviewer'];
const MAY_CLOSE: Role[] = ['reviewer', 'admin'];

const SIGNED_FACTS = [
  { fixesLinked: 0, fixesUnverified: 0 },
  { fixesLinked: 2, fixesUnverified: 1 },
  { fixesLinked: 1, fixesUnverified: 0 },
];

describe('the next step each role is shown', () => {
  it('never names closing, verifying or linking to a role that cannot do it (issue #12)', () => {
    for (const facts of SIGNED_FACTS) {
      for (const role of ROLES) {
        const step = nextStepFor('signed_off', role, facts) ?? '';
        if (/close/i.test(step)) expect(MAY_CLOSE).toContain(role);
        if (/verify/i.test(step)) expect(MAY_VERIFY).toContain(role);
        if (/link the fix/i.test(step)) expect(MAY_LINK).toContain(role);
      }
    }
  });

  it('tells the engineer to link a fix when none is linked, and nothing once one waits for verification', () => {
    expect(nextStepFor('signed_off', 'engineer', SIGNED_FACTS[0])).toMatch(/Link the fix/);
    expect(nextStepFor('signed_off', 'engineer', SIGNED_FACTS[1])).toBeNull();
    expect(nextStepFor('signed_off', 'engineer', SIGNED_FACTS[2])).toBeNull();
    expect(nextStepFor('signed_off', 'investigator', SIGNED_FACTS[1])).toMatch(/Verify/);
    expect(nextStepFor('signed_off', 'reviewer', SIGNED_FACTS[2])).toBe('Close the case');
  });

  it('outside a signed case, shows a step only to a role allowed to cause a move out of the state', () => {
    for (const state of CASE_STATUSES.filter((s) => s !== 'signed_off')) {
      const allowed = new Set(CASE_TRANSITIONS.filter((t) => t.from === state).flatMap((t) => t.roles));
      for (const role of ROLES) {
        if (nextStepFor(state, role, SIGNED_FACTS[0]) !== null) expect([...allowed]).toContain(role);
      }
    }
  });
});
