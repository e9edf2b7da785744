import { type TSavedQuery, ZSavedQueryList } from '@shared/contracts/saved-queries';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export async function getSavedQueries(caseId: string, signal?: AbortSignal): Promise<TSavedQuery[]> {
  return (await apiRequest(apiPaths.caseQueries(caseId), { schema: ZSavedQueryList, signal })).items;
}

/** Under the case-work key, so saving a query also refreshes the findings evidence pickers. */
export function savedQueriesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'saved-queries'] as const,
    queryFn: ({ signal }) => getSavedQueries(caseId, signal),
  });
}

export function useSavedQueries(caseId: string) {
  return useQuery(savedQueriesQueryOptions(caseId));
}
