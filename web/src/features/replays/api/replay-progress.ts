import { isReplayLive, type TReplay } from '@shared/contracts/replays';
import { useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { useEffect, useState } from 'react';
import { bundleReplaysQueryOptions } from './get-bundle-replays';

export interface ReplayProgress {
  step: number;
  steps: number;
}

/**
 * Follows a running replay over server-sent events (`progress` then `finished`) and refreshes the
 * bundle's replay list when it ends. Returns the latest progress, or null before the first event.
 */
export function useReplayProgress(replay: TReplay | undefined): ReplayProgress | null {
  const queryClient = useQueryClient();
  const [progress, setProgress] = useState<ReplayProgress | null>(null);
  const isLive = isReplayLive(replay?.status);
  const replayId = replay?.id;
  const bundleId = replay?.bundleId;

  useEffect(() => {
    if (!isLive || !replayId || !bundleId) return;
    const source = new EventSource(apiPaths.replayProgress(replayId));
    source.addEventListener('progress', (event) => setProgress(JSON.parse((event as MessageEvent).data)));
    source.addEventListener('finished', () => {
      source.close();
      void queryClient.invalidateQueries({ queryKey: bundleReplaysQueryOptions(bundleId).queryKey });
    });
    // The browser reconnects on its own after a dropped stream; a closed one means the server said no.
    source.onerror = () => {
      if (source.readyState === EventSource.CLOSED) {
        void queryClient.invalidateQueries({ queryKey: bundleReplaysQueryOptions(bundleId).queryKey });
      }
    };
    return () => source.close();
  }, [isLive, replayId, bundleId, queryClient]);

  return isLive ? (progress ?? replay?.progress ?? null) : null;
}
