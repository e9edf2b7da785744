import { ZReplay } from '@shared/contracts/replays';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/**
 * A finished replay's probable causes (empty when it has none): cited in the findings and shown
 * beside a fix's verification replay, so both features read them through this one query.
 */
export async function getReplayCauses(replayId: string, signal?: AbortSignal) {
  return (await apiRequest(apiPaths.replay(replayId), { schema: ZReplay, signal })).causes ?? [];
}

export function replayCausesQueryOptions(replayId: string) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'causes'] as const,
    queryFn: ({ signal }) => getReplayCauses(replayId, signal),
  });
}

export function useReplayCauses(replayId: string) {
  return useQuery({ ...replayCausesQueryOptions(replayId), enabled: replayId !== '' });
}
