import { type TRecordingProgress, ZRecordingProgress } from '@shared/contracts/recordings';
import { useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { apiRequest } from '@web/lib/api-client';

export function getRecordingProgress(
  caseId: string,
  progressId: string,
  signal?: AbortSignal,
): Promise<TRecordingProgress> {
  return apiRequest(apiPaths.caseRecordingProgress(caseId, progressId), {
    schema: ZRecordingProgress,
    signal,
  });
}

/**
 * Where the server stands with a recording whose bytes have all been sent, polled twice a second
 * while `isWaiting` (the upload request is still open); a failed poll is only retried, since the
 * upload's own answer says what went wrong.
 */
export function useRecordingProgress(caseId: string, progressId: string | undefined, isWaiting: boolean) {
  return useQuery({
    queryKey: ['recordings', 'progress', caseId, progressId] as const,
    queryFn: ({ signal }) => getRecordingProgress(caseId, progressId as string, signal),
    enabled: Boolean(progressId) && isWaiting,
    refetchInterval: isWaiting ? 500 : false,
    retry: false,
    staleTime: 0,
    gcTime: 0,
  });
}
