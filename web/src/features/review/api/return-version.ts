import type { ZReturnRequest } from '@shared/contracts/findings';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import type { z } from 'zod';

export type TReturnRequest = z.input<typeof ZReturnRequest>;

/** Sends the version back to its author with the reviewer's comment. */
export function returnVersion(caseId: string, version: number, body: TReturnRequest) {
  return apiRequest(apiPaths.caseFindingsReturn(caseId, version), { method: 'POST', body });
}

export function useReturnVersion(caseId: string, version: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TReturnRequest) => returnVersion(caseId, version, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: CASES_KEY }),
  });
}
