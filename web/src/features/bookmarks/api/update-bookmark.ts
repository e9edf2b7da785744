import { type TBookmark, type TUpdateBookmarkRequest, ZBookmark } from '@shared/contracts/bookmarks';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function updateBookmark(bookmarkId: string, body: TUpdateBookmarkRequest): Promise<TBookmark> {
  return apiRequest(apiPaths.bookmark(bookmarkId), { method: 'PATCH', body, schema: ZBookmark });
}

export function useUpdateBookmark(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ bookmarkId, note }: { bookmarkId: string; note: string }) =>
      updateBookmark(bookmarkId, { note }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
}
