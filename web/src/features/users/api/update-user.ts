import { type TUpdateUserRequest, type TUser, ZUser } from '@shared/contracts/users';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { usersQueryOptions } from './get-users';

export function updateUser(userId: string, body: TUpdateUserRequest): Promise<TUser> {
  return apiRequest(apiPaths.user(userId), { method: 'PATCH', body, schema: ZUser });
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, body }: { userId: string; body: TUpdateUserRequest }) => updateUser(userId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: usersQueryOptions().queryKey }),
  });
}
