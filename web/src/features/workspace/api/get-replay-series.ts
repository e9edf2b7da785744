import type { TReplaySeriesResponse } from '@shared/contracts/replays';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getReplaySeries(replayId: string, signal?: AbortSignal): Promise<TReplaySeriesResponse> {
  return apiRequest(apiPaths.replaySeries(replayId), { signal });
}

export function replaySeriesQueryOptions(replayId: string) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'series'] as const,
    queryFn: ({ signal }) => getReplaySeries(replayId, signal),
    // A finished replay's results never change.
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useReplaySeries(replayId: string) {
  return useQuery(replaySeriesQueryOptions(replayId));
}
