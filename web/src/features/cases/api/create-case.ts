import { type TCase, type TCreateCaseRequest, ZCase } from '@shared/contracts/cases';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { caseQueryOptions } from './get-case';
import { caseListKeyPrefix } from './get-cases';

export function createCase(body: TCreateCaseRequest): Promise<TCase> {
  return apiRequest(apiPaths.cases, { method: 'POST', body, schema: ZCase });
}

export function useCreateCase() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCase,
    onSuccess: (created) => {
      queryClient.setQueryData(caseQueryOptions(created.id).queryKey, created);
      return queryClient.invalidateQueries({ queryKey: caseListKeyPrefix });
    },
  });
}
