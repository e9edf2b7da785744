import { type TOutboxList, ZOutboxList } from '@shared/contracts/outbox';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getOutbox(page: number, pageSize: number, signal?: AbortSignal): Promise<TOutboxList> {
  return apiRequest(apiPaths.outbox, { query: { page, pageSize }, schema: ZOutboxList, signal });
}

export function outboxQueryOptions(page: number, pageSize: number) {
  return queryOptions({
    queryKey: ['outbox', 'list', { page, pageSize }] as const,
    queryFn: ({ signal }) => getOutbox(page, pageSize, signal),
    placeholderData: keepPreviousData,
  });
}

export function useOutbox(page: number, pageSize: number) {
  return useQuery(outboxQueryOptions(page, pageSize));
}
