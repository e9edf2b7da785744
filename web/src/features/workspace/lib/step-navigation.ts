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
 * The step of the next (direction +1) or previous (-1) moment of interest, or null when there is
 * none. Each moment (flag start, event or bookmark time, s) lands on its nearest step, and the
 * comparison is made in steps, not seconds: a moment between two steps (an event at 55.767 s with
 * 0.1 s steps) lands on 55.8 s, and from there "previous" moves to the moment before it rather
 * than back onto the same step.
 */
export function adjacentMomentStep(
  moments: readonly number[],
  times: ArrayLike<number>,
  currentStep: number,
  direction: 1 | -1,
): number | null {
  let best: number | null = null;
  for (const m of moments) {
    const k = nearestStep(times, m);
    if (k < 0) continue;
    if (direction > 0 && k > currentStep && (best === null || k < best)) best = k;
    if (direction < 0 && k < currentStep && (best === null || k > best)) best = k;
  }
  return best;
}
