import {
  type TCreateSavedQueryRequest,
  type TSavedQuery,
  ZSavedQuery,
} from '@shared/contracts/saved-queries';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function createSavedQuery(caseId: string, body: TCreateSavedQueryRequest): Promise<TSavedQuery> {
  return apiRequest(apiPaths.caseQueries(caseId), { method: 'POST', body, schema: ZSavedQuery });
}

export function useCreateSavedQuery(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TCreateSavedQueryRequest) => createSavedQuery(caseId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
}
