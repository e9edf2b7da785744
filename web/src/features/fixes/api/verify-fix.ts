import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function verifyFix(caseId: string, fixId: string) {
  return apiRequest(apiPaths.caseFixVerify(caseId, fixId), { method: 'POST', body: {} });
}

export function useVerifyFix(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fixId: string) => verifyFix(caseId, fixId),
    // A verified fix can make the case closable.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: CASES_KEY }),
  });
}
