import { type TCaseMembers, ZCaseMembers } from '@shared/contracts/case-members';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getCaseMembers(caseId: string, signal?: AbortSignal): Promise<TCaseMembers> {
  return apiRequest(apiPaths.caseMembers(caseId), { schema: ZCaseMembers, signal });
}

export function caseMembersQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: ['cases', 'members', caseId] as const,
    queryFn: ({ signal }) => getCaseMembers(caseId, signal),
  });
}

export function useCaseMembers(caseId: string) {
  return useQuery(caseMembersQueryOptions(caseId));
}
