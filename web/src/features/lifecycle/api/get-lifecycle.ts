import { type TCaseLifecycle, ZCaseLifecycle } from '@shared/contracts/case-lifecycle';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getLifecycle(caseId: string, signal?: AbortSignal): Promise<TCaseLifecycle> {
  return apiRequest(apiPaths.caseLifecycle(caseId), { schema: ZCaseLifecycle, signal });
}

export function lifecycleQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'lifecycle'] as const,
    queryFn: ({ signal }) => getLifecycle(caseId, signal),
  });
}

export function useLifecycle(caseId: string) {
  return useQuery(lifecycleQueryOptions(caseId));
}
