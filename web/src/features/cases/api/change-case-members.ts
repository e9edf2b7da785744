import { type TCaseMembers, ZCaseMembers } from '@shared/contracts/case-members';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { caseMembersQueryOptions } from './get-case-members';

export function addCaseMember(caseId: string, userId: string): Promise<TCaseMembers> {
  return apiRequest(apiPaths.caseMembers(caseId), { method: 'POST', body: { userId }, schema: ZCaseMembers });
}

export function removeCaseMember(caseId: string, userId: string): Promise<TCaseMembers> {
  return apiRequest(apiPaths.caseMember(caseId, userId), { method: 'DELETE', schema: ZCaseMembers });
}

/**
 * Adds (`add: true`) or removes one member. The answer is the new member list; everything else
 * about the case is refetched, since what a person may see on it follows its members.
 */
export function useChangeCaseMembers(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, add }: { userId: string; add: boolean }) =>
      add ? addCaseMember(caseId, userId) : removeCaseMember(caseId, userId),
    onSuccess: (members) => {
      queryClient.setQueryData(caseMembersQueryOptions(caseId).queryKey, members);
      return queryClient.invalidateQueries({ queryKey: CASES_KEY });
    },
  });
}
