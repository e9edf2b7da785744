import type { TCaseTransitionRequest } from '@shared/contracts/case-lifecycle';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export interface TransitionResult {
  caseId: string;
  from: string;
  to: string;
  event: string;
}

export function transitionCase(caseId: string, body: TCaseTransitionRequest): Promise<TransitionResult> {
  return apiRequest(apiPaths.caseTransitions(caseId), { method: 'POST', body });
}

export function useTransitionCase(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TCaseTransitionRequest) => transitionCase(caseId, body),
    // The status shows in the case header, the list and the case-work section alike.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: CASES_KEY }),
  });
}
