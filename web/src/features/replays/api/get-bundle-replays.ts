import { type TReplayList, ZReplayList } from '@shared/contracts/replays';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getBundleReplays(bundleId: string, signal?: AbortSignal): Promise<TReplayList> {
  return apiRequest(apiPaths.bundleReplays(bundleId), { schema: ZReplayList, signal });
}

export function bundleReplaysQueryOptions(bundleId: string) {
  return queryOptions({
    queryKey: ['bundles', 'detail', bundleId, 'replays'] as const,
    queryFn: ({ signal }) => getBundleReplays(bundleId, signal),
  });
}

export function useBundleReplays(bundleId: string) {
  return useQuery(bundleReplaysQueryOptions(bundleId));
}
