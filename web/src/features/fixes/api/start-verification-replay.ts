import { type TStartReplayRequest, ZReplay } from '@shared/contracts/replays';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { caseReplaysQueryOptions } from '@web/components/case-replays-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

/** Queues a replay of the incident bundle under the fixed settings (202, runs in the background). */
export function startVerificationReplay(bundleId: string, body: TStartReplayRequest) {
  return apiRequest(apiPaths.bundleReplays(bundleId), { method: 'POST', body, schema: ZReplay });
}

export function useStartVerificationReplay(caseId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ bundleId, body }: { bundleId: string; body: TStartReplayRequest }) =>
      startVerificationReplay(bundleId, body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: caseReplaysQueryOptions(caseId).queryKey }),
  });
}
