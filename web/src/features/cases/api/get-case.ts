import { type TCase, ZCase } from '@shared/contracts/cases';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getCase(caseId: string, signal?: AbortSignal): Promise<TCase> {
  return apiRequest(apiPaths.case(caseId), { schema: ZCase, signal });
}

export function caseQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: ['cases', 'detail', caseId] as const,
    queryFn: ({ signal }) => getCase(caseId, signal),
  });
}

export function useCase(caseId: string) {
  return useQuery(caseQueryOptions(caseId));
}
