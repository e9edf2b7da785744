import type { TBundleMap } from '@shared/contracts/bundle-views';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getBundleMap(bundleId: string, signal?: AbortSignal): Promise<TBundleMap> {
  return apiRequest(apiPaths.bundleMap(bundleId), { signal });
}

export function bundleMapQueryOptions(bundleId: string) {
  return queryOptions({
    queryKey: ['bundles', 'detail', bundleId, 'map'] as const,
    queryFn: ({ signal }) => getBundleMap(bundleId, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useBundleMap(bundleId: string) {
  return useQuery(bundleMapQueryOptions(bundleId));
}
