import { type TArchiveExportList, ZArchiveExportList } from '@shared/contracts/archives';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getCaseArchives(caseId: string, signal?: AbortSignal): Promise<TArchiveExportList> {
  return apiRequest(apiPaths.caseArchives(caseId), { schema: ZArchiveExportList, signal });
}

/** Past exports (custody record) of a case; under the case-work key so any case write refreshes it. */
export function caseArchivesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'archives'] as const,
    queryFn: ({ signal }) => getCaseArchives(caseId, signal),
  });
}

export function useCaseArchives(caseId: string) {
  return useQuery(caseArchivesQueryOptions(caseId));
}
