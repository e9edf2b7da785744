import { type TLinkFixRequest, ZFix } from '@shared/contracts/fixes';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function linkFix(caseId: string, body: TLinkFixRequest) {
  return apiRequest(apiPaths.caseFixes(caseId), { method: 'POST', body, schema: ZFix });
}

export function useLinkFix(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TLinkFixRequest) => linkFix(caseId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseWorkKey(caseId) }),
  });
}
