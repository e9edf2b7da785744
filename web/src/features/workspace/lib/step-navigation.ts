import { nearestStep } from './time-scale';

/**
 * The step after pressing a scrubber key, or null for keys the scrubber does not handle.
 * Arrows move one step; with Shift they move `secondsPerJump` s of recording; Home/End go to the ends.
 */
export function stepAfterKey(
  key: string,
  isShift: boolean,
  current: number,
  times: ArrayLike<number>,
  secondsPerJump = 1,
): number | null {
  const last = times.length - 1;
  if (last < 0) return null;
  const clamp = (k: number) => Math.max(0, Math.min(last, k));
  const forward = key === 'ArrowRight' || key === 'ArrowUp';
  const backward = key === 'ArrowLeft' || key === 'ArrowDown';
  if (forward || backward) {
    if (!isShift) return clamp(current + (forward ? 1 : -1));
    const target = times[clamp(current)] + (forward ? secondsPerJump : -secondsPerJump);
    const k = nearestStep(times, target);
    // Never stand still on a long gap: move at least one step.
    return clamp(k === current ? current + (forward ? 1 : -1) : k);
  }
  if (key === 'Home') return 0;
  if (key === 'End') return last;
  if (key === 'PageUp') return clamp(nearestStep(times, times[clamp(current)] + 10));
  if (key === 'PageDown') return clamp(nearestStep(times, times[clamp(current)] - 10));
  return null;
}

/**
 * Time (s) of the next (direction +1) or previous (-1) moment of interest strictly after/before
 * `t`, or null when there is none. Moments are flag starts and event times, in any order.
 */
export function adjacentMoment(moments: readonly number[], t: number, direction: 1 | -1): number | null {
  // Half a millisecond of slack so jumping onto a moment and pressing again moves on.
  const slack = 5e-4;
  let best: number | null = null;
  for (const m of moments) {
    if (direction > 0 && m > t + slack && (best === null || m < best)) best = m;
    if (direction < 0 && m < t - slack && (best === null || m > best)) best = m;
  }
  return best;
}
