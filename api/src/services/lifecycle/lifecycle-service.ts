import { and, count, eq, isNull } from 'drizzle-orm';
import type { AuditAction } from '../../../../shared/audit-actions';
import { checkTransition, transitionsFrom } from '../../../../shared/case-lifecycle';
import type { TCaseLifecycle, TCaseTransitionRequest } from '../../../../shared/contracts/case-lifecycle';
import type { TCaseStatus } from '../../../../shared/contracts/cases';
import { AppError } from '../../../../shared/errors';
import { type FixFacts, holderOf, nextStepFor } from '../../../../shared/next-step';
import type { Role } from '../../../../shared/roles';
import type { Database, Transaction } from '../../db/client';
import { caseFixes, cases } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { assertNotHeld, findActiveHold } from '../holds/holds-service';
import { assertCaseMember } from '../membership/case-access';
import { loadCaseState } from './case-state';

export interface TransitionResult {
  caseId: string;
  from: TCaseStatus;
  to: TCaseStatus;
  event: string;
}

async function unverifiedFixes(db: Database, caseId: string): Promise<number> {
  const [{ total }] = await db
    .select({ total: count() })
    .from(caseFixes)
    .where(and(eq(caseFixes.caseId, caseId), isNull(caseFixes.verifiedAt)));
  return total;
}

async function fixFacts(db: Database, caseId: string): Promise<FixFacts> {
  const [{ linked }] = await db
    .select({ linked: count() })
    .from(caseFixes)
    .where(eq(caseFixes.caseId, caseId));
  return { fixesLinked: linked, fixesUnverified: await unverifiedFixes(db, caseId) };
}

/**
 * Applies the shared state machine to stored cases. Every status change is an explicit call from
 * the service doing the write that causes it, inside that write's transaction.
 */
export function createLifecycleService({ db, audit }: { db: Database; audit: AuditService }) {
  /** The `case.transition` entry of a move; `why` says what asked for it (a comment or a cause). */
  const auditMove = (tx: Transaction, actor: Actor, moved: TransitionResult, why: Record<string, unknown>) =>
    audit.append(tx, {
      actor,
      action: 'case.transition',
      targetType: 'case',
      targetId: moved.caseId,
      caseId: moved.caseId,
      details: { from: moved.from, to: moved.to, event: moved.event, ...why },
    });

  /** Throws 409 `illegal_transition` (or 403 for a wrong role) unless the move is allowed now. */
  async function assertTransition(
    executor: Database,
    caseId: string,
    to: TCaseStatus,
    role: Role,
    direct: boolean,
  ) {
    const state = await loadCaseState(executor, caseId);
    const check = checkTransition(
      state.status,
      to,
      role,
      { unverifiedFixes: await unverifiedFixes(executor, caseId) },
      { direct },
    );
    if (!check.ok) {
      throw new AppError(check.reason === 'role' ? 'forbidden' : 'illegal_transition', check.message, {
        from: state.status,
        to,
        allowed: transitionsFrom(state.status).map((t) => t.to),
      });
    }
    return { from: state.status, transition: check.transition };
  }

  /**
   * Moves a case to `to` inside `tx` if the machine allows it for this role. `direct` is a plain
   * status request; actions that cause a move themselves (submit, sign, return) pass false. The
   * caller's own audit entry records the move.
   */
  async function transition(
    tx: Transaction,
    caseId: string,
    to: TCaseStatus,
    role: Role,
    direct: boolean,
  ): Promise<TransitionResult> {
    // The hold is named first: under hold no move is possible, whatever the state machine says.
    await assertNotHeld(tx, caseId, `Changing the case status to ${to}`);
    const { from, transition: move } = await assertTransition(tx, caseId, to, role, direct);
    // Conditional on the old status, so two racing requests cannot both move the case.
    const [row] = await tx
      .update(cases)
      .set({ status: to, updatedAt: new Date() })
      .where(and(eq(cases.id, caseId), eq(cases.status, from)))
      .returning({ id: cases.id });
    if (!row)
      throw new AppError(
        'illegal_transition',
        `Case ${caseId} changed status meanwhile; reload and try again.`,
      );
    return { caseId, from, to, event: move.event };
  }

  /** `POST /cases/:id/transitions`: a plain status change, audited as `case.transition` with its comment. */
  async function requestTransition(
    caseId: string,
    request: TCaseTransitionRequest,
    actor: Actor,
  ): Promise<TransitionResult> {
    return db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'move it on');
      const moved = await transition(tx, caseId, request.to, actor.role, true);
      await auditMove(tx, actor, moved, { comment: request.comment });
      return moved;
    });
  }

  /**
   * Starts analysis when work first arrives on an open case (a bundle, a findings draft), inside
   * that work's transaction, and audits the move as `case.transition` caused by `cause`.
   * Does nothing on a case that is not open.
   */
  async function noteWorkStarted(
    tx: Transaction,
    caseId: string,
    actor: Actor,
    cause: AuditAction,
  ): Promise<TransitionResult | null> {
    // Under legal hold an addition is recorded but the status stays as the hold found it.
    if (await findActiveHold(tx, caseId)) return null;
    const [row] = await tx
      .update(cases)
      .set({ status: 'analysing', updatedAt: new Date() })
      .where(and(eq(cases.id, caseId), eq(cases.status, 'open')))
      .returning({ id: cases.id });
    if (!row) return null;
    const moved: TransitionResult = { caseId, from: 'open', to: 'analysing', event: 'start_analysis' };
    await auditMove(tx, actor, moved, { cause });
    return moved;
  }

  async function getLifecycle(caseId: string, actor: Actor): Promise<TCaseLifecycle> {
    await assertCaseMember(db, caseId, actor, 'see its next steps');
    const state = await loadCaseState(db, caseId);
    const hold = await findActiveHold(db, caseId);
    const facts = await fixFacts(db, caseId);
    return {
      caseId,
      status: state.status,
      nextActor: holderOf(state.status, facts),
      yourMove: nextStepFor(state.status, actor.role, facts),
      transitions: transitionsFrom(state.status).map(({ to, event, roles, cause, isDirect }) => ({
        to,
        event,
        roles: [...roles],
        cause,
        isDirect,
      })),
      hold: hold ? { reason: hold.reason, placedBy: hold.placedBy, placedAt: hold.placedAt } : null,
    };
  }

  return { assertTransition, transition, requestTransition, noteWorkStarted, getLifecycle };
}

export type LifecycleService = ReturnType<typeof createLifecycleService>;
