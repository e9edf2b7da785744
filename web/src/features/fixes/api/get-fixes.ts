import { ZFix } from '@shared/contracts/fixes';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { z } from 'zod';

const ZFixList = z.object({ items: z.array(ZFix) });

export function getFixes(caseId: string, signal?: AbortSignal) {
  return apiRequest(apiPaths.caseFixes(caseId), { schema: ZFixList, signal });
}

export function fixesQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'fixes'] as const,
    queryFn: ({ signal }) => getFixes(caseId, signal),
  });
}

export function useFixes(caseId: string) {
  return useQuery(fixesQueryOptions(caseId));
}
