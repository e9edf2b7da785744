import type { Footprint } from '@shared/bundle/types';
import type { TBundleTracks } from '@shared/contracts/bundle-views';
import type { TReplaySeriesResponse } from '@shared/contracts/replays';
import type { SafetyReport } from '@shared/safety/safety-report';
import { useCallback } from 'react';
import type { Frame } from '../lib/map-drawing';
import { poseAtTime } from '../lib/pose-at-time';
import { drawSafetyOverlay } from '../lib/safety-overlay';

/**
 * The map overlay of the separation and stopping analysis at the current step, drawn at the pose
 * the robot really had: the reference pose when the bundle has one, else the replay's mean.
 */
export function useSafetyOverlay(
  safety: SafetyReport | null | undefined,
  footprint: Footprint | undefined,
  tracks: TBundleTracks | undefined,
  series: TReplaySeriesResponse | undefined,
  step: number,
): ((frame: Frame) => void) | undefined {
  const draw = useCallback(
    (frame: Frame) => {
      if (!safety || !footprint || !series) return;
      const time = safety.t[step];
      if (time === undefined) return;
      const c = series.columns;
      const replayPose =
        c.x[step] === null
          ? null
          : { x: c.x[step] as number, y: c.y[step] as number, theta: c.theta[step] as number };
      const pose = poseAtTime(tracks?.reference, time, 0.5) ?? replayPose;
      if (pose) drawSafetyOverlay(frame, { safety, step, footprint, pose });
    },
    [safety, footprint, tracks, series, step],
  );
  return safety ? draw : undefined;
}
