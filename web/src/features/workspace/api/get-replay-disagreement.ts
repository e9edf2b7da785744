import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiPaths } from '@web/config/paths';
import { ApiError } from '@web/lib/api-client';

/**
 * The map-disagreement heat map: one little-endian uint32 per map cell (row 0 northmost), the
 * count of scan endpoints that fell on free cells during the replay.
 */
export async function getReplayDisagreement(replayId: string, signal?: AbortSignal): Promise<Uint32Array> {
  let response: Response;
  try {
    response = await fetch(apiPaths.replayDisagreement(replayId), { credentials: 'same-origin', signal });
  } catch (cause) {
    if (cause instanceof DOMException && cause.name === 'AbortError') throw cause;
    throw new ApiError(0, 'network_error', 'Cannot reach the Driftcase server. Check your connection.');
  }
  if (!response.ok) {
    throw new ApiError(
      response.status,
      'unexpected_response',
      `The heat map is not available (${response.status}).`,
    );
  }
  const bytes = await response.arrayBuffer();
  const view = new DataView(bytes);
  const out = new Uint32Array(bytes.byteLength >> 2);
  for (let i = 0; i < out.length; i++) out[i] = view.getUint32(i * 4, true);
  return out;
}

export function replayDisagreementQueryOptions(replayId: string) {
  return queryOptions({
    queryKey: ['replays', 'detail', replayId, 'disagreement'] as const,
    queryFn: ({ signal }) => getReplayDisagreement(replayId, signal),
    staleTime: Number.POSITIVE_INFINITY,
  });
}

export function useReplayDisagreement(replayId: string, isEnabled: boolean) {
  return useQuery({ ...replayDisagreementQueryOptions(replayId), enabled: isEnabled });
}
