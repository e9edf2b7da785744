import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function logout(): Promise<unknown> {
  return apiRequest(apiPaths.logout, { method: 'POST' });
}

export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    // Drop every cached answer even if the server call failed: the person asked to leave.
    onSettled: () => queryClient.clear(),
  });
}
