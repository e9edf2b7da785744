import { type TFindingsDiff, ZFindingsDiff } from '@shared/contracts/findings';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** Changes from version `from` to version `to`, by JSON path. */
export function getFindingsDiff(
  caseId: string,
  from: number,
  to: number,
  signal?: AbortSignal,
): Promise<TFindingsDiff> {
  return apiRequest(apiPaths.caseFindingsDiff(caseId, to), {
    query: { against: from },
    schema: ZFindingsDiff,
    signal,
  });
}

export function findingsDiffQueryOptions(caseId: string, from: number, to: number) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'findings', 'diff', from, to] as const,
    queryFn: ({ signal }) => getFindingsDiff(caseId, from, to, signal),
  });
}

export function useFindingsDiff(caseId: string, from: number, to: number, isEnabled: boolean) {
  return useQuery({ ...findingsDiffQueryOptions(caseId, from, to), enabled: isEnabled });
}
