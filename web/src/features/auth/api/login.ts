import { type TLoginRequest, type TLoginResponse, ZLoginResponse } from '@shared/contracts/auth';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { meQueryOptions } from './get-me';

export function login(body: TLoginRequest): Promise<TLoginResponse> {
  return apiRequest(apiPaths.login, { method: 'POST', body, schema: ZLoginResponse });
}

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ user, csrfToken }) => {
      // Start from a clean cache so nothing from a previous user's session is ever shown.
      queryClient.clear();
      queryClient.setQueryData(meQueryOptions().queryKey, { user, csrfToken });
    },
  });
}
