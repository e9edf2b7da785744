import { CASE_STATUS_LABELS, type TCaseStatus } from './contracts/cases';
import { ROLE_LABELS, type Role } from './roles';

// Messages are read by people (the case page shows them), so states and roles go in their words.
const said = (state: TCaseStatus) => `“${CASE_STATUS_LABELS[state]}”`;
const roleWords = (roles: readonly Role[]) => roles.map((role) => ROLE_LABELS[role]).join(' or ');

/**
 * The case lifecycle as a pure state machine: which state follows which, who may move it, and
 * which event causes the move. The API enforces it; the case page reads `nextActor` from it.
 */

export const CASE_EVENTS = ['start_analysis', 'submit', 'return', 'sign', 'close', 'reopen'] as const;
export type CaseEvent = (typeof CASE_EVENTS)[number];

export interface CaseTransition {
  from: TCaseStatus;
  to: TCaseStatus;
  event: CaseEvent;
  /** Roles that may cause it. */
  roles: readonly Role[];
  /** What causes it, for messages and the UI. */
  cause: string;
  /**
   * True when a plain status change may request it; false when only its own action may (a
   * submission needs a findings version, a sign-off needs a signature).
   */
  isDirect: boolean;
}

export const CASE_TRANSITIONS: readonly CaseTransition[] = [
  {
    from: 'open',
    to: 'analysing',
    event: 'start_analysis',
    roles: ['investigator', 'admin'],
    cause: 'the first bundle upload or findings draft, or an investigator starting analysis',
    isDirect: true,
  },
  {
    from: 'analysing',
    to: 'in_review',
    event: 'submit',
    roles: ['investigator'],
    cause: 'submitting findings (POST /api/cases/:id/findings/submit)',
    isDirect: false,
  },
  {
    from: 'changes_requested',
    to: 'in_review',
    event: 'submit',
    roles: ['investigator'],
    cause: 'resubmitting findings (POST /api/cases/:id/findings/submit)',
    isDirect: false,
  },
  {
    from: 'in_review',
    to: 'changes_requested',
    event: 'return',
    roles: ['reviewer'],
    cause: 'a reviewer returning the version (POST .../findings/versions/:v/return)',
    isDirect: false,
  },
  {
    from: 'in_review',
    to: 'signed_off',
    event: 'sign',
    roles: ['reviewer'],
    cause: 'a reviewer signing the version (POST .../findings/versions/:v/signoff)',
    isDirect: false,
  },
  {
    from: 'signed_off',
    to: 'closed',
    event: 'close',
    roles: ['reviewer', 'admin'],
    cause: 'closing the case once every linked fix is verified (or none is linked)',
    isDirect: true,
  },
  {
    from: 'signed_off',
    to: 'analysing',
    event: 'reopen',
    roles: ['investigator', 'reviewer', 'admin'],
    cause: 'reopening the signed findings for a new version, which will need a new signature',
    isDirect: true,
  },
  {
    from: 'closed',
    to: 'analysing',
    event: 'reopen',
    roles: ['reviewer', 'admin'],
    cause: 'reopening a closed case',
    isDirect: true,
  },
];

/** Facts outside the status that some transitions depend on. */
export interface TransitionContext {
  /** Fixes linked to the case that are not yet verified. */
  unverifiedFixes: number;
}

export type TransitionCheck =
  | { ok: true; transition: CaseTransition }
  | { ok: false; reason: 'no_such_transition' | 'role' | 'guard' | 'not_direct'; message: string };

/** Transitions that leave a state. */
export function transitionsFrom(state: TCaseStatus): CaseTransition[] {
  return CASE_TRANSITIONS.filter((t) => t.from === state);
}

function describeAllowed(state: TCaseStatus): string {
  const options = transitionsFrom(state).map((t) => `${said(t.to)} (${roleWords(t.roles)}: ${t.cause})`);
  return options.length
    ? `From ${said(state)} the case can go to: ${options.join('; ')}.`
    : `No move leaves ${said(state)}.`;
}

/**
 * Checks a move from one state to another by a role. `direct` means the caller asks for a plain
 * status change rather than performing the action (submit, sign, ...) that causes it.
 */
export function checkTransition(
  from: TCaseStatus,
  to: TCaseStatus,
  role: Role,
  context: TransitionContext,
  options: { direct: boolean },
): TransitionCheck {
  const transition = CASE_TRANSITIONS.find((t) => t.from === from && t.to === to);
  if (!transition) {
    return {
      ok: false,
      reason: 'no_such_transition',
      message: `A case cannot go from ${said(from)} to ${said(to)}. ${describeAllowed(from)}`,
    };
  }
  if (!transition.roles.includes(role)) {
    return {
      ok: false,
      reason: 'role',
      message: `Moving a case from ${said(from)} to ${said(to)} needs the role ${roleWords(transition.roles)}.`,
    };
  }
  if (options.direct && !transition.isDirect) {
    return {
      ok: false,
      reason: 'not_direct',
      message: `A case goes from ${said(from)} to ${said(to)} only by ${transition.cause}, not by a status change.`,
    };
  }
  if (transition.event === 'close' && context.unverifiedFixes > 0) {
    return {
      ok: false,
      reason: 'guard',
      message: `The case cannot close: ${context.unverifiedFixes === 1 ? '1 linked fix is' : `${context.unverifiedFixes} linked fixes are`} not verified yet.`,
    };
  }
  return { ok: true, transition };
}

/** The transition an event causes from a state, if any. */
export function transitionForEvent(from: TCaseStatus, event: CaseEvent): CaseTransition | undefined {
  return CASE_TRANSITIONS.find((t) => t.from === from && t.event === event);
}

/** Who acts next in a state: the roles of the transitions leaving it, and what they do. */
export function nextActor(state: TCaseStatus): { roles: Role[]; action: string } {
  const NEXT: Record<TCaseStatus, { roles: Role[]; action: string }> = {
    open: { roles: ['investigator'], action: 'Upload a bundle or start the findings draft' },
    analysing: { roles: ['investigator'], action: 'Write the findings and submit them for review' },
    in_review: { roles: ['reviewer'], action: 'Sign the submitted findings or return them with comments' },
    changes_requested: { roles: ['investigator'], action: 'Revise the findings and resubmit them' },
    // What happens here depends on the linked fixes: shared/next-step.ts words it per role.
    signed_off: {
      roles: ['engineer', 'reviewer'],
      action: 'An engineer links the fix; it is verified; a safety reviewer closes the case',
    },
    closed: { roles: [], action: 'Nothing: the case is closed' },
  };
  return NEXT[state];
}

/** States in which findings may be edited. */
export function canEditFindings(state: TCaseStatus): boolean {
  return state === 'open' || state === 'analysing' || state === 'changes_requested';
}
