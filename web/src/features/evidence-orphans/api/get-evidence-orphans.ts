import { type TEvidenceOrphans, ZEvidenceOrphans } from '@shared/contracts/evidence-orphans';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getEvidenceOrphans(signal?: AbortSignal): Promise<TEvidenceOrphans> {
  return apiRequest(apiPaths.evidenceOrphans, { schema: ZEvidenceOrphans, signal });
}

export function evidenceOrphansQueryOptions() {
  return queryOptions({
    queryKey: ['evidence', 'orphans'] as const,
    queryFn: ({ signal }) => getEvidenceOrphans(signal),
  });
}

export function useEvidenceOrphans() {
  return useQuery(evidenceOrphansQueryOptions());
}
