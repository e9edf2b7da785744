import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { bundleReplaysQueryOptions } from './get-bundle-replays';

export function cancelReplay(replayId: string): Promise<unknown> {
  return apiRequest(apiPaths.replay(replayId), { method: 'DELETE' });
}

export function useCancelReplay(bundleId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: cancelReplay,
    onSettled: () =>
      queryClient.invalidateQueries({ queryKey: bundleReplaysQueryOptions(bundleId).queryKey }),
  });
}
