import { type TBookmark, ZBookmarkList } from '@shared/contracts/bookmarks';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export async function getBookmarks(caseId: string, signal?: AbortSignal): Promise<TBookmark[]> {
  return (await apiRequest(apiPaths.caseBookmarks(caseId), { schema: ZBookmarkList, signal })).items;
}

/** Under the case-work key, so a bookmark write also refreshes the findings evidence pickers. */
export function bookmarksQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'bookmarks'] as const,
    queryFn: ({ signal }) => getBookmarks(caseId, signal),
  });
}

export function useBookmarks(caseId: string) {
  // The workspace asks before it knows its case: wait for an id rather than fetch a bad address.
  return useQuery({ ...bookmarksQueryOptions(caseId), enabled: caseId !== '' });
}
