import { type TFindingsVersion, ZFindingsVersion } from '@shared/contracts/findings';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** One frozen version; the server re-checks its signature on every read. */
export function getFindingsVersion(
  caseId: string,
  version: number,
  signal?: AbortSignal,
): Promise<TFindingsVersion> {
  return apiRequest(apiPaths.caseFindingsVersion(caseId, version), { schema: ZFindingsVersion, signal });
}

export function findingsVersionQueryOptions(caseId: string, version: number) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'findings', 'versions', version] as const,
    queryFn: ({ signal }) => getFindingsVersion(caseId, version, signal),
  });
}

export function useFindingsVersion(caseId: string, version: number) {
  return useQuery(findingsVersionQueryOptions(caseId, version));
}
