import { describe, expect, it } from 'vitest';
import { checkTransition, nextActor, transitionForEvent } from '../../shared/case-lifecycle';
import { CASE_STATUSES, type TCaseStatus } from '../../shared/contracts/cases';
import { ROLES, type Role } from '../../shared/roles';

/**
 * The lifecycle written out independently of the implementation, as the product specifies it:
 * from → to: roles allowed, and whether a plain status change may request it.
 */
const SPEC: Record<string, { roles: Role[]; isDirect: boolean }> = {
  'open>analysing': { roles: ['investigator', 'admin'], isDirect: true },
  'analysing>in_review': { roles: ['investigator'], isDirect: false },
  'changes_requested>in_review': { roles: ['investigator'], isDirect: false },
  'in_review>changes_requested': { roles: ['reviewer'], isDirect: false },
  'in_review>signed_off': { roles: ['reviewer'], isDirect: false },
  'signed_off>closed': { roles: ['reviewer', 'admin'], isDirect: true },
  'signed_off>analysing': { roles: ['investigator', 'reviewer', 'admin'], isDirect: true },
  'closed>analysing': { roles: ['reviewer', 'admin'], isDirect: true },
};

const NO_FIXES = { unverifiedFixes: 0 };
/** The product's words for the states, as the case page shows them. */
const STATE_WORDS: Record<TCaseStatus, string> = {
  open: 'Open',
  analysing: 'Under analysis',
  in_review: 'In review',
  changes_requested: 'Returned with comments', // the review words of design.md
  signed_off: 'Signed off',
  closed: 'Closed',
};
const pairs = CASE_STATUSES.flatMap((from) =>
  CASE_STATUSES.map((to) => [from, to] as [TCaseStatus, TCaseStatus]),
);

describe('case lifecycle', () => {
  it.each(pairs)('%s → %s is allowed exactly for the specified roles', (from, to) => {
    const spec = SPEC[`${from}>${to}`];
    for (const role of ROLES) {
      const check = checkTransition(from, to, role, NO_FIXES, { direct: false });
      const shouldPass = !!spec && spec.roles.includes(role);
      expect(check.ok, `${from} → ${to} as ${role}`).toBe(shouldPass);
      if (!check.ok) {
        // The message names both states, in words, so a 409 tells the user what was refused.
        expect(check.message).toContain(`“${STATE_WORDS[from]}”`);
        expect(check.message).toContain(`“${STATE_WORDS[to]}”`);
        expect(check.reason).toBe(spec ? 'role' : 'no_such_transition');
      }
    }
  });

  it.each(Object.entries(SPEC))('%s as a plain status change is allowed only when direct', (key, spec) => {
    const [from, to] = key.split('>') as [TCaseStatus, TCaseStatus];
    const check = checkTransition(from, to, spec.roles[0], NO_FIXES, { direct: true });
    expect(check.ok).toBe(spec.isDirect);
    if (!check.ok) expect(check.reason).toBe('not_direct');
  });

  it('lists the allowed moves when a transition does not exist', () => {
    const check = checkTransition('open', 'closed', 'admin', NO_FIXES, { direct: true });
    expect(check.ok).toBe(false);
    if (!check.ok) expect(check.message).toContain('“Under analysis”');
  });

  it('refuses to close while a linked fix is unverified', () => {
    const check = checkTransition(
      'signed_off',
      'closed',
      'reviewer',
      { unverifiedFixes: 2 },
      { direct: true },
    );
    expect(check).toMatchObject({ ok: false, reason: 'guard' });
    expect(checkTransition('signed_off', 'closed', 'reviewer', NO_FIXES, { direct: true }).ok).toBe(true);
  });

  it('maps each event to its transition', () => {
    expect(transitionForEvent('analysing', 'submit')?.to).toBe('in_review');
    expect(transitionForEvent('changes_requested', 'submit')?.to).toBe('in_review');
    expect(transitionForEvent('in_review', 'sign')?.to).toBe('signed_off');
    expect(transitionForEvent('in_review', 'return')?.to).toBe('changes_requested');
    expect(transitionForEvent('open', 'submit')).toBeUndefined();
  });

  it('names who acts next, consistent with the allowed transitions', () => {
    for (const state of CASE_STATUSES) {
      const next = nextActor(state);
      const leaving = Object.entries(SPEC).filter(([key]) => key.startsWith(`${state}>`));
      expect(next.action.length).toBeGreaterThan(0);
      if (state === 'closed') expect(next.roles).toEqual([]);
      else expect(leaving.length).toBeGreaterThan(0);
    }
    expect(nextActor('in_review').roles).toEqual(['reviewer']);
    expect(nextActor('changes_requested').roles).toEqual(['investigator']);
  });
});
