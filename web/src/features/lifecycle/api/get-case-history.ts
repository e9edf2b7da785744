import { type TAuditList, ZAuditList } from '@shared/contracts/audit';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** The newest part of the case's audit chain, enough for the history on the case page. */
export const HISTORY_LENGTH = 200;

export function getCaseHistory(caseId: string, signal?: AbortSignal): Promise<TAuditList> {
  return apiRequest(apiPaths.caseAudit(caseId), {
    query: { page: 1, pageSize: HISTORY_LENGTH },
    schema: ZAuditList,
    signal,
  });
}

export function caseHistoryQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'history'] as const,
    queryFn: ({ signal }) => getCaseHistory(caseId, signal),
  });
}

export function useCaseHistory(caseId: string, isAllowed: boolean) {
  return useQuery({ ...caseHistoryQueryOptions(caseId), enabled: isAllowed });
}
