import { ZSubmitFindingsResponse } from '@shared/contracts/findings';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** Freezes the saved draft as a new version and sends the case to review. */
export function submitFindings(caseId: string) {
  return apiRequest(apiPaths.caseFindingsSubmit(caseId), { method: 'POST', schema: ZSubmitFindingsResponse });
}

export function useSubmitFindings(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => submitFindings(caseId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: CASES_KEY }),
  });
}
