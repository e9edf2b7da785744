import type { TReplay } from '@shared/contracts/replays';
import type { SafetyReport } from '@shared/safety/safety-report';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** The separation and stopping analysis of a finished replay (part of `GET /api/replays/:id`). */
export async function getReplaySafety(replayId: string, signal?: AbortSignal): Promise<SafetyReport | null> {
  const replay = await apiRequest<TReplay>(apiPaths.replay(replayId), { signal });
  return replay.safety ?? null;
}

export function replaySafetyQueryOptions(replayId: string) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'safety'] as const,
    queryFn: ({ signal }) => getReplaySafety(replayId, signal),
    // A finished replay's analysis never changes.
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useReplaySafety(replayId: string) {
  return useQuery(replaySafetyQueryOptions(replayId));
}
