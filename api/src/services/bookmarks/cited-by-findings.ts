import { eq } from 'drizzle-orm';
import type { Database } from '../../db/client';
import { findingVersions } from '../../db/schema';

interface FrozenFindings {
  content?: { evidence?: { type?: string; bookmarkId?: string }[] };
}

/**
 * The findings versions of a case whose evidence cites the bookmark. Versions are frozen, so a
 * bookmark they cite must stay readable for as long as the version does.
 */
export async function findVersionsCitingBookmark(
  db: Database,
  caseId: string,
  bookmarkId: string,
): Promise<number[]> {
  const rows = await db
    .select({ version: findingVersions.version, canonical: findingVersions.canonical })
    .from(findingVersions)
    .where(eq(findingVersions.caseId, caseId));
  return rows
    .filter((row) =>
      ((JSON.parse(row.canonical) as FrozenFindings).content?.evidence ?? []).some(
        (item) => item.type === 'bookmark' && item.bookmarkId === bookmarkId,
      ),
    )
    .map((row) => row.version)
    .sort((a, b) => a - b);
}
