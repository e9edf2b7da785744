import { type TFindingsResponse, ZFindingsResponse } from '@shared/contracts/findings';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getFindings(caseId: string, signal?: AbortSignal): Promise<TFindingsResponse> {
  return apiRequest(apiPaths.caseFindings(caseId), { schema: ZFindingsResponse, signal });
}

export function findingsQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'findings'] as const,
    queryFn: ({ signal }) => getFindings(caseId, signal),
  });
}

export function useFindings(caseId: string) {
  return useQuery(findingsQueryOptions(caseId));
}
