import { type TReplay, type TStartReplayRequest, ZReplay } from '@shared/contracts/replays';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { bundleReplaysQueryOptions } from './get-bundle-replays';

export function startReplay(bundleId: string, body: TStartReplayRequest): Promise<TReplay> {
  return apiRequest(apiPaths.bundleReplays(bundleId), { method: 'POST', body, schema: ZReplay });
}

export function useStartReplay(bundleId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: TStartReplayRequest) => startReplay(bundleId, body),
    onSuccess: () =>
      queryClient.invalidateQueries({ queryKey: bundleReplaysQueryOptions(bundleId).queryKey }),
  });
}
