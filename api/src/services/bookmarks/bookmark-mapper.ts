import type { TBookmark, TBookmarkView } from '../../../../shared/contracts/bookmarks';
import type { BookmarkRow } from '../../db/schema';
import type { Person } from '../findings/people';

export function toBookmark(row: BookmarkRow, people: Map<string, Person>): TBookmark {
  return {
    id: row.id,
    caseId: row.caseId,
    bundleId: row.bundleId,
    replayId: row.replayId,
    replayLabel: row.replayLabel,
    replayDigest: row.replayDigest,
    step: row.step,
    t: row.t,
    view: row.view as TBookmarkView,
    note: row.note,
    author: { id: row.authorId, name: people.get(row.authorId)?.name ?? '' },
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}
