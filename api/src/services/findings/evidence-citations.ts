import { eq } from 'drizzle-orm';
import type { TEvidenceItem } from '../../../../shared/contracts/findings';
import { AppError, type FieldIssue } from '../../../../shared/errors';
import type { Database } from '../../db/client';
import { bookmarks, bundles, figures, replays, savedQueries } from '../../db/schema';

export type ReplayCauses = (replayId: string) => Promise<readonly { kind: string }[] | null>;

/** The probable-cause kinds of each replay a cause citation names, keyed by replay id. */
export type CitedCauseKinds = ReadonlyMap<string, readonly string[]>;

/**
 * Reads the causes of every replay that `items` cite a cause of. Runs before the submit
 * transaction opens: reading causes may rebuild a replay's files through the pool's own
 * connection, which would wait forever on a single-connection database held by that transaction.
 */
export async function loadCitedCauseKinds(
  items: readonly TEvidenceItem[],
  replayCauses: ReplayCauses,
): Promise<CitedCauseKinds> {
  const kinds = new Map<string, readonly string[]>();
  for (const item of items) {
    if (item.type !== 'cause' || kinds.has(item.replayId)) continue;
    const causes = await replayCauses(item.replayId).catch(() => null);
    kinds.set(
      item.replayId,
      (causes ?? []).map((cause) => cause.kind),
    );
  }
  return kinds;
}

/**
 * Checks that cited replays (and the cited probable cause of one) and bundle files exist in this
 * case and that the cited hash is the stored one; cited bookmarks and saved queries must belong
 * to the case, and a saved query's result hash must be the stored one; so must a cited figure's.
 */
export async function validateEvidence(
  db: Database,
  caseId: string,
  items: readonly TEvidenceItem[],
  causeKinds: CitedCauseKinds,
): Promise<void> {
  const issues: FieldIssue[] = [];
  for (const [index, item] of items.entries()) {
    const at = `evidence.${index}`;
    if (item.type === 'replay' || item.type === 'cause') {
      const [row] = await db
        .select({ digest: replays.digest, caseId: bundles.caseId })
        .from(replays)
        .innerJoin(bundles, eq(bundles.id, replays.bundleId))
        .where(eq(replays.id, item.replayId));
      if (!row || row.caseId !== caseId)
        issues.push({ path: `${at}.replayId`, message: `No replay ${item.replayId} in this case` });
      else if (row.digest !== item.digest) {
        issues.push({
          path: `${at}.digest`,
          message: `Replay ${item.replayId} has digest ${row.digest ?? '(none yet)'}`,
        });
      } else if (item.type === 'cause') {
        const kinds = causeKinds.get(item.replayId);
        if (!kinds)
          issues.push({
            path: `${at}.kind`,
            message: 'The draft changed while it was being submitted; submit it again',
          });
        else if (!kinds.includes(item.kind))
          issues.push({
            path: `${at}.kind`,
            message: `Replay ${item.replayId} has no probable cause of kind ${item.kind}`,
          });
      }
    } else if (item.type === 'bookmark') {
      const [row] = await db
        .select({ caseId: bookmarks.caseId })
        .from(bookmarks)
        .where(eq(bookmarks.id, item.bookmarkId));
      if (!row || row.caseId !== caseId)
        issues.push({ path: `${at}.bookmarkId`, message: `No bookmark ${item.bookmarkId} in this case` });
    } else if (item.type === 'saved_query') {
      const [row] = await db
        .select({ caseId: savedQueries.caseId, resultSha256: savedQueries.resultSha256 })
        .from(savedQueries)
        .where(eq(savedQueries.id, item.queryId));
      if (!row || row.caseId !== caseId)
        issues.push({ path: `${at}.queryId`, message: `No saved query ${item.queryId} in this case` });
      else if (row.resultSha256 !== item.resultSha256) {
        issues.push({
          path: `${at}.resultSha256`,
          message: `Saved query ${item.queryId} has result SHA-256 ${row.resultSha256}`,
        });
      }
    } else if (item.type === 'bundle_file') {
      const [row] = await db
        .select({ caseId: bundles.caseId, files: bundles.files })
        .from(bundles)
        .where(eq(bundles.id, item.bundleId));
      const file = (row?.files as { name: string; sha256: string }[] | undefined)?.find(
        (f) => f.name === item.file,
      );
      if (!row || row.caseId !== caseId)
        issues.push({ path: `${at}.bundleId`, message: `No bundle ${item.bundleId} in this case` });
      else if (!file)
        issues.push({ path: `${at}.file`, message: `Bundle ${item.bundleId} has no file ${item.file}` });
      else if (file.sha256 !== item.sha256) {
        issues.push({ path: `${at}.sha256`, message: `${item.file} has SHA-256 ${file.sha256}` });
      }
    } else if (item.type === 'figure') {
      const [row] = await db
        .select({ caseId: figures.caseId, sha256: figures.sha256 })
        .from(figures)
        .where(eq(figures.id, item.figureId));
      if (!row || row.caseId !== caseId)
        issues.push({ path: `${at}.figureId`, message: `No figure ${item.figureId} in this case` });
      else if (row.sha256 !== item.sha256)
        issues.push({ path: `${at}.sha256`, message: `Figure ${item.figureId} has SHA-256 ${row.sha256}` });
    }
  }
  if (issues.length) {
    throw new AppError(
      'validation_failed',
      `Evidence does not match the stored records: ${issues.map((i) => `${i.path}: ${i.message}`).join('; ')}`,
      issues,
    );
  }
}
