import { CASE_STAGES, type TCasePath, type TCaseStage, type TCaseStatus } from './contracts/cases';
import { holderOf } from './next-step';

/**
 * A case's path through Driftcase's own stages — evidence in → replayed → findings drafted →
 * signed → fix verified → closed — worked out from stored facts, so the list, the case page and
 * report.html show the same answer. Pure: the API gathers the facts.
 */

export const CASE_STAGE_LABELS: Record<TCaseStage, string> = {
  evidence_in: 'Evidence in',
  replayed: 'Replayed',
  findings_drafted: 'Findings drafted',
  signed: 'Signed',
  fix_verified: 'Fix verified',
  closed: 'Closed',
};

/** What the stored records say about one case; times are RFC 3339, null when it never happened. */
export interface CasePathFacts {
  status: TCaseStatus;
  /** The case record's creation. */
  openedAt: string;
  /** The latest change of status (a transition, submission, sign-off or return); null if none. */
  statusChangedAt: string | null;
  firstValidBundleAt: string | null;
  firstFinishedReplayAt: string | null;
  /** The earliest findings draft save or submitted version. */
  findingsStartedAt: string | null;
  /** The latest sign-off of a findings version. */
  lastSignedAt: string | null;
  fixesLinked: number;
  fixesUnverified: number;
  lastFixVerifiedAt: string | null;
}

const isSigned = (status: TCaseStatus) => status === 'signed_off' || status === 'closed';

const latest = (...times: (string | null)[]): string | null =>
  times.reduce<string | null>(
    (best, time) => (time !== null && (best === null || Date.parse(time) > Date.parse(best)) ? time : best),
    null,
  );

/** When each stage was reached on the facts, or null; signing and closing follow the status. */
function reachedAt(facts: CasePathFacts): Record<TCaseStage, string | null> {
  const signed = isSigned(facts.status);
  const allFixesVerified = signed && facts.fixesLinked > 0 && facts.fixesUnverified === 0;
  return {
    evidence_in: facts.firstValidBundleAt,
    replayed: facts.firstFinishedReplayAt,
    findings_drafted: facts.findingsStartedAt,
    signed: signed ? (facts.lastSignedAt ?? facts.statusChangedAt) : null,
    fix_verified: allFixesVerified ? facts.lastFixVerifiedAt : null,
    closed: facts.status === 'closed' ? (facts.statusChangedAt ?? facts.openedAt) : null,
  };
}

function describeStanding(facts: CasePathFacts, reached: Record<TCaseStage, string | null>): string {
  switch (facts.status) {
    case 'in_review':
      return 'Findings awaiting sign-off';
    case 'changes_requested':
      return 'Findings returned with comments';
    case 'signed_off':
      if (facts.fixesLinked === 0) return 'Signed; no fix linked yet';
      return facts.fixesUnverified > 0 ? 'Signed; fix awaiting verification' : 'Fix verified; ready to close';
    case 'closed':
      return facts.fixesLinked === 0 ? 'Closed without a linked fix' : 'Closed';
    default:
      if (reached.findings_drafted) return 'Findings being drafted';
      if (reached.replayed) return 'Replayed; findings not started';
      if (reached.evidence_in) return 'Evidence in; not replayed yet';
      return 'Waiting for evidence';
  }
}

/** The case's path: every stage with its state and time, where it stands, who holds it and since when. */
export function deriveCasePath(facts: CasePathFacts): TCasePath {
  const reached = reachedAt(facts);
  const standing = [...CASE_STAGES].reverse().find((stage) => reached[stage] !== null) ?? null;
  const isClosedWithoutFix = facts.status === 'closed' && facts.fixesLinked === 0;
  const nowStage =
    facts.status === 'closed' ? undefined : CASE_STAGES.find((stage) => reached[stage] === null);
  const stages = CASE_STAGES.map((stage) => ({
    stage,
    state:
      reached[stage] !== null
        ? ('done' as const)
        : stage === 'fix_verified' && isClosedWithoutFix
          ? ('skipped' as const)
          : stage === nowStage
            ? ('now' as const)
            : ('todo' as const),
    at: reached[stage],
  }));
  const next = holderOf(facts.status, facts);
  return {
    stages,
    standing,
    summary: describeStanding(facts, reached),
    holders: [...next.roles],
    task: next.action,
    since:
      latest(facts.openedAt, facts.statusChangedAt, standing ? reached[standing] : null) ?? facts.openedAt,
  };
}
