import { randomUUID } from 'node:crypto';
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { TCaseHold, TPlaceHoldRequest, TReleaseHoldRequest } from '../../../../shared/contracts/holds';
import { AppError } from '../../../../shared/errors';
import { formatUtcInstant } from '../../../../shared/site-time';
import type { Database } from '../../db/client';
import { type CaseHoldRow, caseHolds, users } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { assertCaseMember } from '../membership/case-access';

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

/** The active hold of a case, or null; `db` may be an open transaction. */
export async function findActiveHold(db: Database, caseId: string): Promise<TCaseHold | null> {
  const [row] = await db
    .select()
    .from(caseHolds)
    .where(and(eq(caseHolds.caseId, caseId), isNull(caseHolds.releasedAt)))
    .orderBy(desc(caseHolds.placedAt))
    .limit(1);
  return row ? toHold(row) : null;
}

/** "under legal hold placed by Name (e-mail) on <time>: <reason>", for messages that refuse a change. */
export async function describeHold(db: Database, hold: TCaseHold): Promise<string> {
  const [placer] = await db
    .select({ name: users.name, email: users.email })
    .from(users)
    .where(eq(users.id, hold.placedBy));
  const who = placer ? `${placer.name} (${placer.email})` : `user ${hold.placedBy}`;
  return `under legal hold placed by ${who} on ${formatUtcInstant(hold.placedAt)} (${hold.reason})`;
}

/**
 * Throws 409 `on_hold` when the case is under legal hold. Services call it, inside the write's
 * transaction, before changing or deleting anything already recorded on a case: the case record
 * and its status, findings, bookmarks and their notes, bundles (README, "Legal hold"). Additions
 * (a new bundle, replay, bookmark, saved query, fix) are allowed and audited as usual.
 * @param what the refused action, for the message (e.g. "Deleting bundle 3f2…").
 */
export async function assertNotHeld(db: Database, caseId: string, what = 'This change'): Promise<void> {
  const hold = await findActiveHold(db, caseId);
  if (hold) {
    throw new AppError(
      'on_hold',
      `${what} is not allowed: case ${caseId} is ${await describeHold(db, hold)}. Additions are still allowed; changes wait until legal lifts the hold.`,
      { caseId, hold },
    );
  }
}

/** Legal holds: while one is active nothing already recorded on the case may be changed or deleted. */
export function createHoldsService({ db, audit }: { db: Database; audit: AuditService }) {
  async function placeHold(caseId: string, request: TPlaceHoldRequest, actor: Actor): Promise<TCaseHold> {
    return db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'place a legal hold on it');
      const existing = await findActiveHold(tx, caseId);
      if (existing) {
        throw new AppError(
          'conflict',
          `Case ${caseId} is already under legal hold since ${existing.placedAt}.`,
          { hold: existing },
        );
      }
      const [row] = await tx
        .insert(caseHolds)
        .values({ id: randomUUID(), caseId, reason: request.reason, placedBy: actor.id })
        .returning();
      await audit.append(tx, {
        actor,
        action: 'hold.place',
        targetType: 'hold',
        targetId: row.id,
        caseId,
        details: { reason: request.reason },
      });
      return toHold(row);
    });
  }

  async function releaseHold(caseId: string, request: TReleaseHoldRequest, actor: Actor): Promise<TCaseHold> {
    return db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'lift its legal hold');
      const [row] = await tx
        .update(caseHolds)
        .set({ releasedAt: new Date(), releasedBy: actor.id, releaseReason: request.reason ?? null })
        .where(and(eq(caseHolds.caseId, caseId), isNull(caseHolds.releasedAt)))
        .returning();
      if (!row)
        throw new AppError(
          'conflict',
          `Case ${caseId} is not under legal hold; there is nothing to release.`,
        );
      await audit.append(tx, {
        actor,
        action: 'hold.release',
        targetType: 'hold',
        targetId: row.id,
        caseId,
        payload: { reason: request.reason ?? null },
      });
      return toHold(row);
    });
  }

  async function listHolds(caseId: string): Promise<TCaseHold[]> {
    const rows = await db
      .select()
      .from(caseHolds)
      .where(eq(caseHolds.caseId, caseId))
      .orderBy(desc(caseHolds.placedAt));
    return rows.map(toHold);
  }

  /** The active hold and every earlier one, for the case's members. */
  async function holdStatus(caseId: string, actor: Actor) {
    await assertCaseMember(db, caseId, actor, 'see its legal holds');
    return { active: await findActiveHold(db, caseId), history: await listHolds(caseId) };
  }

  return { holdStatus, placeHold, releaseHold };
}

export type HoldsService = ReturnType<typeof createHoldsService>;
