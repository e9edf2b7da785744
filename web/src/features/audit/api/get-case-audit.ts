import { type TAuditList, ZAuditList } from '@shared/contracts/audit';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getCaseAudit(
  caseId: string,
  page: number,
  pageSize: number,
  signal?: AbortSignal,
): Promise<TAuditList> {
  return apiRequest(apiPaths.caseAudit(caseId), { query: { page, pageSize }, schema: ZAuditList, signal });
}

export function caseAuditQueryOptions(caseId: string, page: number, pageSize: number) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'audit', { page, pageSize }] as const,
    queryFn: ({ signal }) => getCaseAudit(caseId, page, pageSize, signal),
    placeholderData: keepPreviousData,
  });
}

export function useCaseAudit(caseId: string, page: number, pageSize: number) {
  return useQuery(caseAuditQueryOptions(caseId, page, pageSize));
}
