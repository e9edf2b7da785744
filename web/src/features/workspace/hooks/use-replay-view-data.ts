import { useBundleMap } from '../api/get-bundle-map';
import { useBundleTracks } from '../api/get-bundle-tracks';
import { useReplayClearance } from '../api/get-replay-clearance';
import { useReplaySeries } from '../api/get-replay-series';

/** Everything a replay's map and timeline need, loaded in parallel. */
export function useReplayViewData(bundleId: string, replayId: string) {
  const series = useReplaySeries(replayId);
  const map = useBundleMap(bundleId);
  const tracks = useBundleTracks(bundleId);
  const clearance = useReplayClearance(bundleId, replayId);
  const error = series.error ?? map.error;
  return {
    series: series.data,
    map: map.data,
    tracks: tracks.data,
    clearance: clearance.data?.clearance,
    isLoading: series.isPending || map.isPending,
    error,
    retry: () => {
      void series.refetch();
      void map.refetch();
    },
  };
}
