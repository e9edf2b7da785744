import type { TSavedQuery } from '../../../../shared/contracts/saved-queries';
import type { SavedQueryRow } from '../../db/schema';
import type { Person } from '../findings/people';

export function toSavedQuery(row: SavedQueryRow, people: Map<string, Person>): TSavedQuery {
  const preview = row.preview as unknown[][] | null;
  return {
    id: row.id,
    caseId: row.caseId,
    bundleId: row.bundleId,
    title: row.title,
    sql: row.sql,
    resultSha256: row.resultSha256,
    rowCount: row.rowCount,
    columns: row.columns as string[],
    preview,
    isHashCheckedByServer: preview !== null && preview.length === row.rowCount,
    author: { id: row.authorId, name: people.get(row.authorId)?.name ?? '' },
    createdAt: row.createdAt.toISOString(),
  };
}
