import { type TMemberCandidate, ZMemberCandidate } from '@shared/contracts/case-members';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { z } from 'zod';

const ZCandidates = z.object({ items: z.array(ZMemberCandidate) });

export async function getMemberCandidates(caseId: string, signal?: AbortSignal): Promise<TMemberCandidate[]> {
  return (await apiRequest(apiPaths.caseMemberCandidates(caseId), { schema: ZCandidates, signal })).items;
}

export function memberCandidatesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: ['cases', 'members', caseId, 'candidates'] as const,
    queryFn: ({ signal }) => getMemberCandidates(caseId, signal),
  });
}

/** Only the case's creator or an admin may ask, so the list loads only when `isEnabled`. */
export function useMemberCandidates(caseId: string, isEnabled: boolean) {
  return useQuery({ ...memberCandidatesQueryOptions(caseId), enabled: isEnabled });
}
