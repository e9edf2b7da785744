import type { TBundleTracks } from '@shared/contracts/bundle-views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getBundleTracks(bundleId: string, signal?: AbortSignal): Promise<TBundleTracks> {
  return apiRequest(apiPaths.bundleTracks(bundleId), { signal });
}

export function bundleTracksQueryOptions(bundleId: string) {
  return queryOptions({
    queryKey: ['bundles', 'detail', bundleId, 'tracks'] as const,
    queryFn: ({ signal }) => getBundleTracks(bundleId, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useBundleTracks(bundleId: string) {
  return useQuery(bundleTracksQueryOptions(bundleId));
}
