import { asc, eq } from 'drizzle-orm';
import type { TEvidenceNamesResponse } from '../../../../shared/contracts/evidence-names';
import type { Database } from '../../db/client';
import { bookmarks, bundles, figures, replays, savedQueries } from '../../db/schema';

/** Every citable item of a case with what people call it (see shared/evidence-names.ts). */
export async function readEvidenceNames(db: Database, caseId: string): Promise<TEvidenceNamesResponse> {
  const [replayRows, bookmarkRows, queryRows, bundleRows, figureRows] = await Promise.all([
    db
      .select({ id: replays.id, label: replays.label, bundleId: replays.bundleId })
      .from(replays)
      .innerJoin(bundles, eq(bundles.id, replays.bundleId))
      .where(eq(bundles.caseId, caseId))
      .orderBy(asc(replays.createdAt), asc(replays.id)),
    db
      .select({
        id: bookmarks.id,
        note: bookmarks.note,
        t: bookmarks.t,
        replayId: bookmarks.replayId,
        replayLabel: bookmarks.replayLabel,
        bundleId: bookmarks.bundleId,
      })
      .from(bookmarks)
      .where(eq(bookmarks.caseId, caseId))
      .orderBy(asc(bookmarks.t), asc(bookmarks.id)),
    db
      .select({ id: savedQueries.id, title: savedQueries.title, bundleId: savedQueries.bundleId })
      .from(savedQueries)
      .where(eq(savedQueries.caseId, caseId))
      .orderBy(asc(savedQueries.title), asc(savedQueries.id)),
    db
      .select({ id: bundles.id, originalName: bundles.originalName })
      .from(bundles)
      .where(eq(bundles.caseId, caseId))
      .orderBy(asc(bundles.uploadedAt), asc(bundles.id)),
    db
      .select({
        id: figures.id,
        caption: figures.caption,
        fileName: figures.fileName,
        sha256: figures.sha256,
      })
      .from(figures)
      .where(eq(figures.caseId, caseId))
      .orderBy(asc(figures.uploadedAt), asc(figures.id)),
  ]);
  return {
    replays: replayRows,
    bookmarks: bookmarkRows,
    queries: queryRows,
    bundles: bundleRows,
    figures: figureRows,
  };
}
