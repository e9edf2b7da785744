import { randomUUID } from 'node:crypto';
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { TCaseHold, TPlaceHoldRequest, TReleaseHoldRequest } from '../../../../shared/contracts/holds';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { type CaseHoldRow, caseHolds } from '../../db/schema';
import { loadCaseState } from '../lifecycle/case-state';

function toHold(row: CaseHoldRow): TCaseHold {
  return {
    id: row.id,
    caseId: row.caseId,
    reason: row.reason,
    placedBy: row.placedBy,
    placedAt: row.placedAt.toISOString(),
    releasedBy: row.releasedBy,
    releasedAt: row.releasedAt?.toISOString() ?? null,
    releaseReason: row.releaseReason,
  };
}

/** Legal holds: while one is active nothing of the case may be deleted and findings stay as they are. */
export function createHoldsService({ db }: { db: Database }) {
  async function activeHold(caseId: string): Promise<TCaseHold | null> {
    const [row] = await db
      .select()
      .from(caseHolds)
      .where(and(eq(caseHolds.caseId, caseId), isNull(caseHolds.releasedAt)))
      .orderBy(desc(caseHolds.placedAt))
      .limit(1);
    return row ? toHold(row) : null;
  }

  /**
   * Throws 409 `on_hold` when the case is under legal hold. Other services call it before
   * deleting anything that belongs to a case (bundles, replays, ...).
   * @param what the refused action, for the message (e.g. "Deleting bundle 3f2…").
   */
  async function assertNotHeld(caseId: string, what = 'This change'): Promise<void> {
    const hold = await activeHold(caseId);
    if (hold) {
      throw new AppError(
        'on_hold',
        `${what} is not allowed: case ${caseId} is under legal hold since ${hold.placedAt} (${hold.reason}).`,
        { caseId, hold },
      );
    }
  }

  async function placeHold(caseId: string, request: TPlaceHoldRequest, actorId: string): Promise<TCaseHold> {
    await loadCaseState(db, caseId);
    const existing = await activeHold(caseId);
    if (existing) {
      throw new AppError(
        'conflict',
        `Case ${caseId} is already under legal hold since ${existing.placedAt}.`,
        { hold: existing },
      );
    }
    const [row] = await db
      .insert(caseHolds)
      .values({ id: randomUUID(), caseId, reason: request.reason, placedBy: actorId })
      .returning();
    return toHold(row);
  }

  async function releaseHold(
    caseId: string,
    request: TReleaseHoldRequest,
    actorId: string,
  ): Promise<TCaseHold> {
    await loadCaseState(db, caseId);
    const [row] = await db
      .update(caseHolds)
      .set({ releasedAt: new Date(), releasedBy: actorId, releaseReason: request.reason ?? null })
      .where(and(eq(caseHolds.caseId, caseId), isNull(caseHolds.releasedAt)))
      .returning();
    if (!row)
      throw new AppError('conflict', `Case ${caseId} is not under legal hold; there is nothing to release.`);
    return toHold(row);
  }

  async function listHolds(caseId: string): Promise<TCaseHold[]> {
    const rows = await db
      .select()
      .from(caseHolds)
      .where(eq(caseHolds.caseId, caseId))
      .orderBy(desc(caseHolds.placedAt));
    return rows.map(toHold);
  }

  return { activeHold, assertNotHeld, placeHold, releaseHold, listHolds };
}

export type HoldsService = ReturnType<typeof createHoldsService>;
