import { type TCase, type TUpdateCaseRequest, ZCase } from '@shared/contracts/cases';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { caseQueryOptions } from './get-case';
import { caseListKeyPrefix } from './get-cases';

export function updateCase(caseId: string, body: TUpdateCaseRequest): Promise<TCase> {
  return apiRequest(apiPaths.case(caseId), { method: 'PATCH', body, schema: ZCase });
}

export function useUpdateCase(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TUpdateCaseRequest) => updateCase(caseId, body),
    onSuccess: (updated) => {
      queryClient.setQueryData(caseQueryOptions(caseId).queryKey, updated);
      return queryClient.invalidateQueries({ queryKey: caseListKeyPrefix });
    },
  });
}
