import type { TPlaceHoldRequest, TReleaseHoldRequest } from '@shared/contracts/holds';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function placeHold(caseId: string, body: TPlaceHoldRequest): Promise<unknown> {
  return apiRequest(apiPaths.caseHold(caseId), { method: 'POST', body });
}

export function releaseHold(caseId: string, body: TReleaseHoldRequest): Promise<unknown> {
  return apiRequest(apiPaths.caseHold(caseId), { method: 'DELETE', body });
}

/** Places (`reason` required) or lifts a hold; either changes what every case-work page allows. */
export function useChangeHold(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ place, reason }: { place: boolean; reason: string }) =>
      place ? placeHold(caseId, { reason }) : releaseHold(caseId, { reason: reason || undefined }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
}
