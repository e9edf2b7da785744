import { ZFindingsVersionSummary } from '@shared/contracts/findings';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { z } from 'zod';

const ZVersionList = z.object({ items: z.array(ZFindingsVersionSummary) });

export function getFindingsVersions(caseId: string, signal?: AbortSignal) {
  return apiRequest(apiPaths.caseFindingsVersions(caseId), { schema: ZVersionList, signal });
}

export function findingsVersionsQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'findings', 'versions'] as const,
    queryFn: ({ signal }) => getFindingsVersions(caseId, signal),
  });
}

export function useFindingsVersions(caseId: string) {
  return useQuery(findingsVersionsQueryOptions(caseId));
}
