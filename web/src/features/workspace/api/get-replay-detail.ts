import type { TProbableCause, TReplay } from '@shared/contracts/replays';
import type { SafetyReport } from '@shared/safety/safety-report';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/**
 * `GET /api/replays/:id` of a finished replay, for what only the single replay carries: its
 * separation and stopping analysis and its probable causes. One request serves both.
 */
export async function getReplayDetail(replayId: string, signal?: AbortSignal): Promise<TReplay> {
  return apiRequest<TReplay>(apiPaths.replay(replayId), { signal });
}

export function replayDetailQueryOptions(replayId: string) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'analysis'] as const,
    queryFn: ({ signal }) => getReplayDetail(replayId, signal),
    // A finished replay's analysis and causes never change.
    staleTime: Number.POSITIVE_INFINITY,
  });
}

/** The separation and stopping analysis, or null when the replay has none. */
export function useReplaySafety(replayId: string) {
  return useQuery({
    ...replayDetailQueryOptions(replayId),
    select: (replay): SafetyReport | null => replay.safety ?? null,
  });
}

/** The probable causes, highest confidence first, or null when the replay has none. */
export function useReplayCauses(replayId: string) {
  return useQuery({
    ...replayDetailQueryOptions(replayId),
    select: (replay): TProbableCause[] | null => replay.causes ?? null,
  });
}
