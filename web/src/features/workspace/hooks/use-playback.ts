import { useEffect, useRef, useState } from 'react';
import { nearestStep } from '../lib/time-scale';

export const PLAYBACK_SPEEDS = [0.25, 1, 4] as const;
export type PlaybackSpeed = (typeof PLAYBACK_SPEEDS)[number];

/**
 * Plays the replay in recorded time at `speed` x: each animation frame moves the cursor to the
 * step nearest the elapsed recording time, and stops at the last step.
 */
export function usePlayback(times: ArrayLike<number>, step: number, onStep: (step: number) => void) {
  const [isPlaying, setIsPlaying] = useState(false);
  const [speed, setSpeed] = useState<PlaybackSpeed>(1);
  const stepRef = useRef(step);
  stepRef.current = step;
  const onStepRef = useRef(onStep);
  onStepRef.current = onStep;

  useEffect(() => {
    if (!isPlaying || times.length === 0) return;
    const last = times.length - 1;
    const startStep = stepRef.current >= last ? 0 : stepRef.current;
    const startTime = times[startStep];
    const startClock = performance.now();
    let frame = requestAnimationFrame(function advance(now) {
      const target = startTime + ((now - startClock) / 1000) * speed;
      const k = nearestStep(times, target);
      if (k !== stepRef.current) onStepRef.current(k);
      if (k >= last) {
        setIsPlaying(false);
        return;
      }
      frame = requestAnimationFrame(advance);
    });
    return () => cancelAnimationFrame(frame);
  }, [isPlaying, speed, times]);

  return { isPlaying, setIsPlaying, togglePlaying: () => setIsPlaying((p) => !p), speed, setSpeed };
}
