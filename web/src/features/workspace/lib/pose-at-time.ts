import type { TPoseTrack } from '@shared/contracts/bundle-views';
import { nearestStep } from './time-scale';

/**
 * The recorded pose nearest in time to `t` (s), or null when the track is absent or its nearest
 * reading is more than `maxGap` s away (a pose from long ago would mislead).
 */
export function poseAtTime(
  track: TPoseTrack | null | undefined,
  t: number,
  maxGap = 1,
): { x: number; y: number; theta: number } | null {
  if (!track || track.t.length === 0) return null;
  const k = nearestStep(track.t, t);
  if (Math.abs(track.t[k] - t) > maxGap) return null;
  return { x: track.x[k], y: track.y[k], theta: track.theta[k] };
}
