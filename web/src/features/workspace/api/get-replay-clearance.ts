import type { TReplayClearance } from '@shared/contracts/bundle-views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getReplayClearance(
  bundleId: string,
  replayId: string,
  signal?: AbortSignal,
): Promise<TReplayClearance> {
  return apiRequest(apiPaths.replayClearance(bundleId, replayId), { signal });
}

export function replayClearanceQueryOptions(bundleId: string, replayId: string) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'clearance'] as const,
    queryFn: ({ signal }) => getReplayClearance(bundleId, replayId, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useReplayClearance(bundleId: string, replayId: string) {
  return useQuery(replayClearanceQueryOptions(bundleId, replayId));
}
