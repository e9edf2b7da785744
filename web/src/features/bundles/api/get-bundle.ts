import { type TBundleRecord, ZBundleRecord } from '@shared/contracts/bundles';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getBundle(bundleId: string, signal?: AbortSignal): Promise<TBundleRecord> {
  return apiRequest(apiPaths.bundle(bundleId), { schema: ZBundleRecord, signal });
}

export function bundleQueryOptions(bundleId: string) {
  return queryOptions({
    queryKey: ['bundles', 'detail', bundleId] as const,
    queryFn: ({ signal }) => getBundle(bundleId, signal),
    // A stored bundle never changes: it is evidence.
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useBundle(bundleId: string) {
  return useQuery(bundleQueryOptions(bundleId));
}
