import { and, count, eq, isNull } from 'drizzle-orm';
import { checkTransition, nextActor, transitionsFrom } from '../../../../shared/case-lifecycle';
import type { TCaseLifecycle } from '../../../../shared/contracts/case-lifecycle';
import type { TCaseStatus } from '../../../../shared/contracts/cases';
import { AppError } from '../../../../shared/errors';
import type { Role } from '../../../../shared/roles';
import type { Database } from '../../db/client';
import { caseFixes, cases } from '../../db/schema';
import type { HoldsService } from '../holds/holds-service';
import { loadCaseState } from './case-state';

export interface TransitionResult {
  caseId: string;
  from: TCaseStatus;
  to: TCaseStatus;
  event: string;
}

/** Applies the shared state machine to stored cases. */
export function createLifecycleService({ db, holds }: { db: Database; holds: HoldsService }) {
  async function unverifiedFixes(caseId: string): Promise<number> {
    const [{ total }] = await db
      .select({ total: count() })
      .from(caseFixes)
      .where(and(eq(caseFixes.caseId, caseId), isNull(caseFixes.verifiedAt)));
    return total;
  }

  /** Throws 409 `illegal_transition` (or 403 for a wrong role) unless the move is allowed now. */
  async function assertTransition(caseId: string, to: TCaseStatus, role: Role, direct: boolean) {
    const state = await loadCaseState(db, caseId);
    const check = checkTransition(
      state.status,
      to,
      role,
      { unverifiedFixes: await unverifiedFixes(caseId) },
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
   * Moves a case to `to` if the machine allows it for this role. `direct` is a plain status
   * request; actions that cause a move themselves (submit, sign, return) pass false.
   */
  async function transition(
    caseId: string,
    to: TCaseStatus,
    role: Role,
    direct: boolean,
  ): Promise<TransitionResult> {
    const { from, transition: move } = await assertTransition(caseId, to, role, direct);
    // Conditional on the old status, so two racing requests cannot both move the case.
    const [row] = await db
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

  /** Starts analysis when work first arrives on an open case; does nothing otherwise. */
  async function noteWorkStarted(caseId: string): Promise<TransitionResult | null> {
    const [row] = await db
      .update(cases)
      .set({ status: 'analysing', updatedAt: new Date() })
      .where(and(eq(cases.id, caseId), eq(cases.status, 'open')))
      .returning({ id: cases.id });
    return row ? { caseId, from: 'open', to: 'analysing', event: 'start_analysis' } : null;
  }

  async function getLifecycle(caseId: string): Promise<TCaseLifecycle> {
    const state = await loadCaseState(db, caseId);
    const hold = await holds.activeHold(caseId);
    return {
      caseId,
      status: state.status,
      nextActor: nextActor(state.status),
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

  return { assertTransition, transition, noteWorkStarted, getLifecycle };
}

export type LifecycleService = ReturnType<typeof createLifecycleService>;
