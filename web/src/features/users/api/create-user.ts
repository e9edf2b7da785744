import { type TCreateUserRequest, type TUser, ZUser } from '@shared/contracts/users';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { usersQueryOptions } from './get-users';

export function createUser(body: TCreateUserRequest): Promise<TUser> {
  return apiRequest(apiPaths.users, { method: 'POST', body, schema: ZUser });
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
  });
}
