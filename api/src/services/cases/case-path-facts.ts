import { and, count, eq, inArray, max, min, or, sql } from 'drizzle-orm';
import type { CasePathFacts } from '../../../../shared/case-path';
import type { TCaseStatus } from '../../../../shared/contracts/cases';
import type { Database } from '../../db/client';
import {
  auditEntries,
  bundles,
  caseFixes,
  findingDrafts,
  findingReviews,
  findingVersions,
  replays,
} from '../../db/schema';

/** Audit actions that change a case's status (a `case.update` only when it carried a status). */
const STATUS_ACTIONS = ['case.transition', 'findings.submit', 'findings.signoff', 'findings.return'];

const iso = (value: Date | string | null | undefined): string | null =>
  value === null || value === undefined ? null : new Date(value).toISOString();

const earliest = (...times: (string | null)[]): string | null =>
  times.reduce<string | null>(
    (best, time) => (time !== null && (best === null || Date.parse(time) < Date.parse(best)) ? time : best),
    null,
  );

function byCase<T extends { caseId: string }>(rows: T[]): Map<string, T> {
  return new Map(rows.map((row) => [row.caseId, row]));
}

/**
 * The facts each case's path is worked out from, for a page of cases at once: one grouped query
 * per kind of record, so a list of 100 cases costs seven queries, not seven hundred.
 */
export async function loadCasePathFacts(
  db: Database,
  caseRows: { id: string; status: TCaseStatus; createdAt: Date }[],
): Promise<Map<string, CasePathFacts>> {
  const ids = caseRows.map((row) => row.id);
  if (ids.length === 0) return new Map();
  const [bundleRows, replayRows, draftRows, versionRows, signRows, fixRows, statusRows] = await Promise.all([
    db
      .select({ caseId: bundles.caseId, at: min(bundles.uploadedAt) })
      .from(bundles)
      .where(and(inArray(bundles.caseId, ids), eq(bundles.status, 'valid')))
      .groupBy(bundles.caseId),
    db
      .select({ caseId: bundles.caseId, at: min(replays.finishedAt) })
      .from(replays)
      .innerJoin(bundles, eq(bundles.id, replays.bundleId))
      .where(and(inArray(bundles.caseId, ids), eq(replays.status, 'done')))
      .groupBy(bundles.caseId),
    db
      .select({ caseId: findingDrafts.caseId, at: findingDrafts.updatedAt })
      .from(findingDrafts)
      .where(inArray(findingDrafts.caseId, ids)),
    db
      .select({ caseId: findingVersions.caseId, at: min(findingVersions.submittedAt) })
      .from(findingVersions)
      .where(inArray(findingVersions.caseId, ids))
      .groupBy(findingVersions.caseId),
    db
      .select({ caseId: findingReviews.caseId, at: max(findingReviews.at) })
      .from(findingReviews)
      .where(and(inArray(findingReviews.caseId, ids), eq(findingReviews.kind, 'signoff')))
      .groupBy(findingReviews.caseId),
    db
      .select({
        caseId: caseFixes.caseId,
        linked: count(),
        verified: count(caseFixes.verifiedAt),
        at: max(caseFixes.verifiedAt),
      })
      .from(caseFixes)
      .where(inArray(caseFixes.caseId, ids))
      .groupBy(caseFixes.caseId),
    db
      .select({ caseId: sql<string>`${auditEntries.caseId}`, at: max(auditEntries.at) })
      .from(auditEntries)
      .where(
        and(
          inArray(auditEntries.caseId, ids),
          or(
            inArray(auditEntries.action, STATUS_ACTIONS),
            and(eq(auditEntries.action, 'case.update'), sql`${auditEntries.details} ? 'status'`),
          ),
        ),
      )
      .groupBy(auditEntries.caseId),
  ]);
  const [bundleAt, replayAt, draftAt, versionAt, signAt, fixes, statusAt] = [
    byCase(bundleRows),
    byCase(replayRows),
    byCase(draftRows),
    byCase(versionRows),
    byCase(signRows),
    byCase(fixRows),
    byCase(statusRows),
  ];
  return new Map(
    caseRows.map((row) => {
      const fix = fixes.get(row.id);
      return [
        row.id,
        {
          status: row.status,
          openedAt: row.createdAt.toISOString(),
          statusChangedAt: iso(statusAt.get(row.id)?.at),
          firstValidBundleAt: iso(bundleAt.get(row.id)?.at),
          firstFinishedReplayAt: iso(replayAt.get(row.id)?.at),
          findingsStartedAt: earliest(iso(draftAt.get(row.id)?.at), iso(versionAt.get(row.id)?.at)),
          lastSignedAt: iso(signAt.get(row.id)?.at),
          fixesLinked: fix?.linked ?? 0,
          fixesUnverified: fix ? fix.linked - fix.verified : 0,
          lastFixVerifiedAt: iso(fix?.at),
        },
      ];
    }),
  );
}
