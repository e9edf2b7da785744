import { nextActor } from './case-lifecycle';
import type { TCaseStatus } from './contracts/cases';
import type { Role } from './roles';

/** Facts beyond the status that decide what a signed case waits for. */
export interface FixFacts {
  fixesLinked: number;
  fixesUnverified: number;
}

/** Roles that may verify a fix (the fix routes' access) and close a signed case (the lifecycle). */
const FIX_VERIFIERS: readonly Role[] = ['investigator', 'reviewer'];

/**
 * Who holds the case and what they do next. A signed case first waits for an engineer to link a
 * fix (a safety reviewer may close it without one), then for a verifier, then for the reviewer
 * to close it: naming each step's own roles keeps the engineer from being told to close the case.
 */
export function holderOf(status: TCaseStatus, facts: FixFacts): { roles: Role[]; action: string } {
  if (status !== 'signed_off') return nextActor(status);
  if (facts.fixesLinked === 0)
    return {
      roles: ['engineer', 'reviewer'],
      action: 'An engineer links the fix; a safety reviewer may close the case if no fix is needed',
    };
  if (facts.fixesUnverified > 0)
    return { roles: [...FIX_VERIFIERS], action: 'Verify the linked fix against its verification replay' };
  return { roles: ['reviewer'], action: 'Close the case' };
}

/**
 * The next step the given role can take itself, in words naming only that role's own actions;
 * null when the case waits for someone else.
 */
export function nextStepFor(status: TCaseStatus, role: Role, facts: FixFacts): string | null {
  const holder = holderOf(status, facts);
  if (!holder.roles.includes(role)) return null;
  if (status !== 'signed_off') return holder.action;
  if (facts.fixesLinked === 0)
    return role === 'engineer'
      ? 'Link the fix with a replay that shows the problem gone'
      : 'Close the case if no fix is needed, or wait for an engineer to link one';
  if (facts.fixesUnverified > 0)
    return role === 'reviewer'
      ? 'Verify the linked fix against its verification replay, then close the case'
      : holder.action;
  return holder.action;
}
