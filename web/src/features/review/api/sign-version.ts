import { ZSignoffResponse } from '@shared/contracts/findings';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function signVersion(caseId: string, version: number) {
  return apiRequest(apiPaths.caseFindingsSignoff(caseId, version), {
    method: 'POST',
    body: { acknowledgeCaution: true },
    schema: ZSignoffResponse,
  });
}

export function useSignVersion(caseId: string, version: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => signVersion(caseId, version),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: CASES_KEY }),
  });
}
