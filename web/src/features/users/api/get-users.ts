import { type TUserList, ZUserList } from '@shared/contracts/users';
import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getUsers(signal?: AbortSignal): Promise<TUserList> {
  return apiRequest(apiPaths.users, { schema: ZUserList, signal });
}

export function usersQueryOptions() {
  return queryOptions({ queryKey: ['users', 'list'] as const, queryFn: ({ signal }) => getUsers(signal) });
}

export function useUsers() {
  return useQuery(usersQueryOptions());
}
