import { type TBundleList, ZBundleList } from '@shared/contracts/bundles';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getCaseBundles(caseId: string, signal?: AbortSignal): Promise<TBundleList> {
  return apiRequest(apiPaths.caseBundles(caseId), { schema: ZBundleList, signal });
}

export function caseBundlesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: ['cases', 'detail', caseId, 'bundles'] as const,
    queryFn: ({ signal }) => getCaseBundles(caseId, signal),
  });
}

export function useCaseBundles(caseId: string) {
  return useQuery(caseBundlesQueryOptions(caseId));
}
