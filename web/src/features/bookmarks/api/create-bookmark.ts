import { type TBookmark, type TCreateBookmarkRequest, ZBookmark } from '@shared/contracts/bookmarks';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function createBookmark(caseId: string, body: TCreateBookmarkRequest): Promise<TBookmark> {
  return apiRequest(apiPaths.caseBookmarks(caseId), { method: 'POST', body, schema: ZBookmark });
}

export function useCreateBookmark(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TCreateBookmarkRequest) => createBookmark(caseId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
}
