import { randomUUID } from 'node:crypto';
import { and, asc, eq } from 'drizzle-orm';
import type { TFix, TLinkFixRequest, TVerifyFixRequest } from '../../../../shared/contracts/fixes';
import { AppError } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { bundles, type CaseFixRow, caseFixes, replays } from '../../db/schema';
import type { Actor } from '../actor';
import type { AuditService } from '../audit/audit-service';
import { loadPeople, type Person } from '../findings/people';
import { loadCaseState } from '../lifecycle/case-state';
import type { Notifications } from '../mail/notifications';
import { assertCaseMember } from '../membership/case-access';
import { judgeVerificationReplay } from './judge-verification-replay';

function toFix(row: CaseFixRow, people: Map<string, Person>): TFix {
  const who = (id: string) => ({ id, name: people.get(id)?.name ?? '' });
  return {
    id: row.id,
    caseId: row.caseId,
    url: row.url,
    commitId: row.commitId,
    description: row.description,
    changedSettings: row.changedSettings,
    softwareVersion: row.softwareVersion,
    verificationReplayId: row.verificationReplayId,
    linkedBy: who(row.linkedBy),
    linkedAt: row.linkedAt.toISOString(),
    verifiedBy: row.verifiedBy ? who(row.verifiedBy) : null,
    verifiedAt: row.verifiedAt?.toISOString() ?? null,
    verificationComment: row.verificationComment,
    isVerifiedWithoutImprovement: row.isVerifiedWithoutImprovement,
  };
}

/** Fixes linked to a case, each with the replay that should show the problem gone. */
export function createFixesService(deps: { db: Database; audit: AuditService; notify: Notifications }) {
  const { db, audit, notify } = deps;
  async function withPeople(rows: CaseFixRow[]): Promise<TFix[]> {
    const people = await loadPeople(
      db,
      rows.flatMap((r) => [r.linkedBy, ...(r.verifiedBy ? [r.verifiedBy] : [])]),
    );
    return rows.map((row) => toFix(row, people));
  }

  async function listFixes(caseId: string, actor: Actor): Promise<TFix[]> {
    await assertCaseMember(db, caseId, actor, 'see its fixes');
    return readFixes(caseId);
  }

  /** The case's fixes, unchecked: for the archive export, which checks membership once. */
  async function readFixes(caseId: string): Promise<TFix[]> {
    await loadCaseState(db, caseId);
    return withPeople(
      await db.select().from(caseFixes).where(eq(caseFixes.caseId, caseId)).orderBy(asc(caseFixes.linkedAt)),
    );
  }

  async function linkFix(caseId: string, request: TLinkFixRequest, actor: Actor): Promise<TFix> {
    const changedSettings =
      request.changedSettings === undefined
        ? null
        : typeof request.changedSettings === 'string'
          ? request.changedSettings
          : JSON.stringify(request.changedSettings, null, 2);
    const row = await db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'link fixes to it');
      if (request.verificationReplayId) {
        const [replay] = await tx
          .select({ caseId: bundles.caseId })
          .from(replays)
          .innerJoin(bundles, eq(bundles.id, replays.bundleId))
          .where(eq(replays.id, request.verificationReplayId));
        if (!replay || replay.caseId !== caseId) {
          throw new AppError(
            'validation_failed',
            `verificationReplayId: no replay ${request.verificationReplayId} in this case.`,
            [{ path: 'verificationReplayId', message: 'No such replay in this case' }],
          );
        }
      }
      const [inserted] = await tx
        .insert(caseFixes)
        .values({
          id: randomUUID(),
          caseId,
          url: request.url ?? null,
          commitId: request.commitId ?? null,
          description: request.description,
          changedSettings,
          softwareVersion: request.softwareVersion ?? null,
          verificationReplayId: request.verificationReplayId ?? null,
          linkedBy: actor.id,
        })
        .returning();
      await audit.append(tx, {
        actor,
        action: 'fix.link',
        targetType: 'fix',
        targetId: inserted.id,
        caseId,
        payload: { ...request, changedSettings },
      });
      return inserted;
    });
    await notify.fixLinked({ caseId, description: request.description, linkedByEmail: actor.email });
    return (await withPeople([row]))[0];
  }

  async function verifyFix(
    caseId: string,
    fixId: string,
    request: TVerifyFixRequest,
    actor: Actor,
  ): Promise<TFix> {
    const row = await db.transaction(async (tx) => {
      await assertCaseMember(tx, caseId, actor, 'verify its fixes');
      const [existing] = await tx
        .select()
        .from(caseFixes)
        .where(and(eq(caseFixes.caseId, caseId), eq(caseFixes.id, fixId)));
      if (!existing) throw new AppError('not_found', `Case ${caseId} has no fix ${fixId}.`);
      if (existing.verifiedAt)
        throw new AppError(
          'conflict',
          `Fix ${fixId} was already verified at ${existing.verifiedAt.toISOString()}.`,
        );
      const outcome = await judgeVerificationReplay(tx, existing.verificationReplayId);
      const isConfirmed = request.confirmWithoutImprovement === true;
      if (outcome.kind !== 'improved' && !isConfirmed)
        throw new AppError(
          'validation_failed',
          `${outcome.warning} To verify the fix anyway, confirm it (confirmWithoutImprovement: true).`,
          [{ path: 'confirmWithoutImprovement', message: outcome.warning }],
        );
      const [updated] = await tx
        .update(caseFixes)
        .set({
          verifiedAt: new Date(),
          verifiedBy: actor.id,
          verificationComment: request.comment,
          isVerifiedWithoutImprovement: outcome.kind !== 'improved',
        })
        .where(eq(caseFixes.id, fixId))
        .returning();
      await audit.append(tx, {
        actor,
        action: 'fix.verify',
        targetType: 'fix',
        targetId: fixId,
        caseId,
        // Details (not only a payload hash) so the case history shows what the verifier wrote.
        details: {
          comment: request.comment,
          outcome: outcome.kind,
          ...(outcome.kind === 'improved'
            ? { improvements: outcome.improvements }
            : { warning: outcome.warning, confirmedWithoutImprovement: true }),
        },
      });
      return updated;
    });
    return (await withPeople([row]))[0];
  }

  return { listFixes, readFixes, linkFix, verifyFix };
}

export type FixesService = ReturnType<typeof createFixesService>;
