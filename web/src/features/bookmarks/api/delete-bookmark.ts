import { type TBookmark, ZBookmark } from '@shared/contracts/bookmarks';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function deleteBookmark(bookmarkId: string): Promise<TBookmark> {
  return apiRequest(apiPaths.bookmark(bookmarkId), { method: 'DELETE', schema: ZBookmark });
}

export function useDeleteBookmark(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteBookmark,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
}
