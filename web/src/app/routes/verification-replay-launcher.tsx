import type { TReplay } from '@shared/contracts/replays';
import { MAX_PARTICLES } from '@shared/engine/settings';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { ReplayLauncher } from '@web/features/replays/components/replay-launcher';
import { useBundleTracks } from '@web/features/workspace/api/get-bundle-tracks';

/**
 * The replay settings form (the workspace's own, fields starting at the manifest's settings) for
 * the fix page's verification replay: composed here because features do not import each other.
 */
export function VerificationReplayLauncher({
  bundleId,
  onStarted,
}: {
  bundleId: string;
  onStarted: (replay: TReplay) => void;
}) {
  const tracks = useBundleTracks(bundleId);
  if (tracks.isError)
    return (
      <ErrorState
        error={tracks.error}
        title="Could not read the manifest's settings"
        onRetry={() => tracks.refetch()}
      />
    );
  if (!tracks.data) return <SkeletonBar className="h-40 w-full" />;
  return (
    <ReplayLauncher
      key={bundleId}
      bundleId={bundleId}
      defaults={tracks.data.filter}
      limits={{ scanBeams: tracks.data.scanBeams ?? null, maxParticles: MAX_PARTICLES }}
      onStarted={onStarted}
    />
  );
}
