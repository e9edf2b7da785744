import { type TMeResponse, ZMeResponse } from '@shared/contracts/auth';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** The signed-in user; rejects with a 401 `ApiError` when there is no session. */
export function getMe(): Promise<TMeResponse> {
  return apiRequest(apiPaths.me, { schema: ZMeResponse });
}

export function meQueryOptions() {
  return queryOptions({ queryKey: ['auth', 'me'] as const, queryFn: getMe, staleTime: 5 * 60_000 });
}

export function useMe() {
  return useQuery(meQueryOptions());
}
