import { ZEvidenceNamesResponse } from '@shared/contracts/evidence-names';
import { toEvidenceNames } from '@shared/evidence-names';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export async function getEvidenceNames(caseId: string, signal?: AbortSignal) {
  return toEvidenceNames(
    await apiRequest(apiPaths.caseEvidenceNames(caseId), { schema: ZEvidenceNamesResponse, signal }),
  );
}

/** Under the case-work key: a new bookmark or saved query renames nothing stale. */
export function evidenceNamesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'evidence-names'] as const,
    queryFn: ({ signal }) => getEvidenceNames(caseId, signal),
  });
}

export function useEvidenceNames(caseId: string) {
  return useQuery(evidenceNamesQueryOptions(caseId));
}
