/**
 * A recorded pose track (onboard or reference) resampled at the replay's step times by linear
 * interpolation, the heading along the shorter way round. Steps further than `maxGap` seconds from
 * a recorded pose on either side get NaN: the track says nothing there.
 */
import type { PoseColumns } from '../bundle/types';

export interface StepPoses {
  x: Float64Array;
  y: Float64Array;
  theta: Float64Array;
}

const TWO_PI = 2 * Math.PI;

function wrap(angle: number): number {
  let a = angle;
  while (a > Math.PI) a -= TWO_PI;
  while (a <= -Math.PI) a += TWO_PI;
  return a;
}

export function poseAtSteps(
  track: PoseColumns | undefined,
  stepTimes: Float64Array,
  maxGap = 0.5,
): StepPoses {
  const n = stepTimes.length;
  const out = {
    x: new Float64Array(n).fill(Number.NaN),
    y: new Float64Array(n).fill(Number.NaN),
    theta: new Float64Array(n).fill(Number.NaN),
  };
  if (!track || track.t.length === 0) return out;
  let k = 0;
  for (let s = 0; s < n; s++) {
    const t = stepTimes[s];
    while (k + 1 < track.t.length && track.t[k + 1] <= t) k++;
    const before = track.t[k] <= t ? k : -1;
    const after = before >= 0 ? (before + 1 < track.t.length ? before + 1 : -1) : 0;
    if (before >= 0 && track.t[before] === t) {
      out.x[s] = track.x[before];
      out.y[s] = track.y[before];
      out.theta[s] = track.theta[before];
    } else if (before >= 0 && after >= 0 && track.t[after] - track.t[before] <= 2 * maxGap) {
      const f = (t - track.t[before]) / (track.t[after] - track.t[before]);
      out.x[s] = track.x[before] + f * (track.x[after] - track.x[before]);
      out.y[s] = track.y[before] + f * (track.y[after] - track.y[before]);
      out.theta[s] = wrap(track.theta[before] + f * wrap(track.theta[after] - track.theta[before]));
    } else {
      const nearest = before >= 0 ? before : after;
      if (nearest >= 0 && Math.abs(track.t[nearest] - t) <= maxGap) {
        out.x[s] = track.x[nearest];
        out.y[s] = track.y[nearest];
        out.theta[s] = track.theta[nearest];
      }
    }
  }
  return out;
}
