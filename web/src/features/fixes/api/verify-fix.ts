import { type TVerifyFixRequest, ZFix } from '@shared/contracts/fixes';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function verifyFix(caseId: string, fixId: string, body: TVerifyFixRequest) {
  return apiRequest(apiPaths.caseFixVerify(caseId, fixId), { method: 'POST', body, schema: ZFix });
}

export function useVerifyFix(caseId: string, fixId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TVerifyFixRequest) => verifyFix(caseId, fixId, body),
    // A verified fix can make the case closable.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: CASES_KEY }),
  });
}
