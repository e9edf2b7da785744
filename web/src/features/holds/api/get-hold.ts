import { ZCaseHold } from '@shared/contracts/holds';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { caseWorkKey } from '@web/components/case-work-query-key';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { z } from 'zod';

export const ZHoldState = z.object({ active: ZCaseHold.nullable(), history: z.array(ZCaseHold) });
export type THoldState = z.infer<typeof ZHoldState>;

export function getHold(caseId: string, signal?: AbortSignal): Promise<THoldState> {
  return apiRequest(apiPaths.caseHold(caseId), { schema: ZHoldState, signal });
}

export function holdQueryOptions(caseId: string) {
  return queryOptions({
    queryKey: [...caseWorkKey(caseId), 'hold'] as const,
    queryFn: ({ signal }) => getHold(caseId, signal),
  });
}

export function useHold(caseId: string) {
  return useQuery(holdQueryOptions(caseId));
}
