import type { TReplayStepResponse } from '@shared/contracts/replays';
import { keepPreviousData, queryOptions, useQuery, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { useEffect } from 'react';

export function getReplayStep(
  replayId: string,
  step: number,
  signal?: AbortSignal,
): Promise<TReplayStepResponse> {
  return apiRequest(apiPaths.replayStep(replayId, step), { signal });
}

export function replayStepQueryOptions(replayId: string, step: number) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'steps', step] as const,
    queryFn: ({ signal }) => getReplayStep(replayId, step, signal),
    staleTime: Number.POSITIVE_INFINITY,
    // About 2,000 particles x 4 numbers per step: keep a few hundred steps, then let them go.
    gcTime: 60_000,
  });
}

/** Steps fetched ahead of and behind the cursor so scrubbing draws from the cache. */
export const PREFETCH_AHEAD = 12;
export const PREFETCH_BEHIND = 4;

/**
 * The particle set at `step`, keeping the previous one on screen while the next loads, and
 * prefetching the steps around the cursor.
 */
export function useReplayStep(replayId: string, step: number, lastStep: number) {
  const queryClient = useQueryClient();
  useEffect(() => {
    for (let k = step - PREFETCH_BEHIND; k <= step + PREFETCH_AHEAD; k++) {
      if (k < 0 || k > lastStep || k === step) continue;
      void queryClient.prefetchQuery(replayStepQueryOptions(replayId, k));
    }
  }, [queryClient, replayId, step, lastStep]);
  return useQuery({ ...replayStepQueryOptions(replayId, step), placeholderData: keepPreviousData });
}
