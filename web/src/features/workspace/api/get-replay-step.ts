import type { TReplayStepResponse } from '@shared/contracts/replays';
import { queryOptions, useQueryClient } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';
import { useEffect, useState } from 'react';
import { StepLane, type StepLaneState } from '../lib/step-lane';

export function getReplayStep(
  replayId: string,
  step: number,
  signal?: AbortSignal,
): Promise<TReplayStepResponse> {
  return apiRequest(apiPaths.replayStep(replayId, step), { signal });
}

export function replayStepQueryOptions(replayId: string, step: number) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'steps', step] as const,
    queryFn: ({ signal }) => getReplayStep(replayId, step, signal),
    staleTime: Number.POSITIVE_INFINITY,
    // About 2,000 particles x 4 numbers per step: keep a few hundred steps, then let them go.
    gcTime: 60_000,
  });
}

export interface ReplayStepView {
  /** The particle set on screen; its `step` may differ from the cursor while the next one loads. */
  data: TReplayStepResponse | undefined;
  /** The cursor's step. */
  target: number;
  /** True while the data on screen is not the cursor's step. */
  isStale: boolean;
  error: Error | null;
}

/**
 * The particle set at the cursor's `step`, fetched latest-wins through a {@link StepLane}: the
 * query cache holds answered steps, superseded requests are aborted, and the step on screen is
 * always named so a stale drawing can say so.
 */
export function useReplayStep(replayId: string, step: number, lastStep: number): ReplayStepView {
  const queryClient = useQueryClient();
  const [state, setState] = useState<StepLaneState<TReplayStepResponse> | null>(null);
  const [lane, setLane] = useState<StepLane<TReplayStepResponse> | null>(null);
  useEffect(() => {
    const lane = new StepLane<TReplayStepResponse>({
      lastStep,
      fetchStep: (k, signal) => getReplayStep(replayId, k, signal),
      readCache: (k) => queryClient.getQueryData(replayStepQueryOptions(replayId, k).queryKey),
      writeCache: (k, value) => queryClient.setQueryData(replayStepQueryOptions(replayId, k).queryKey, value),
      onChange: setState,
    });
    setLane(lane);
    setState(null);
    return () => lane.dispose();
  }, [queryClient, replayId, lastStep]);
  useEffect(() => {
    lane?.seek(step);
  }, [lane, step]);
  const drawn = state?.drawn;
  return {
    data: drawn,
    target: step,
    isStale: !drawn || drawn.step !== step,
    error: state && state.target === step ? state.error : null,
  };
}
