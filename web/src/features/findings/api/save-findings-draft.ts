import { type TFindingsDraft, type TFindingsResponse, ZFindingsResponse } from '@shared/contracts/findings';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { CASES_KEY } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { findingsQueryOptions } from './get-findings';

export function saveFindingsDraft(caseId: string, body: TFindingsDraft): Promise<TFindingsResponse> {
  return apiRequest(apiPaths.caseFindings(caseId), { method: 'PUT', body, schema: ZFindingsResponse });
}

export function useSaveFindingsDraft(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TFindingsDraft) => saveFindingsDraft(caseId, body),
    onSuccess: (saved) => {
      queryClient.setQueryData(findingsQueryOptions(caseId).queryKey, saved);
      // A first draft can start the analysis, which changes the case status.
      return queryClient.invalidateQueries({ queryKey: CASES_KEY });
    },
  });
}
