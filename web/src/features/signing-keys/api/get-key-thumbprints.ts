import { type TKeyThumbprints, ZKeyThumbprints } from '@shared/contracts/keys';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getKeyThumbprints(signal?: AbortSignal): Promise<TKeyThumbprints> {
  return apiRequest(apiPaths.keyThumbprints, { schema: ZKeyThumbprints, signal });
}

export function keyThumbprintsQueryOptions() {
  return queryOptions({
    queryKey: ['signing-keys', 'thumbprints'] as const,
    queryFn: ({ signal }) => getKeyThumbprints(signal),
  });
}

export function useKeyThumbprints() {
  return useQuery(keyThumbprintsQueryOptions());
}
