import { Button } from '@web/components/button';
import { Pause, Play, SkipBack, SkipForward } from 'lucide-react';
import { type KeyboardEvent, type PointerEvent, useId } from 'react';
import { PLAYBACK_SPEEDS, type PlaybackSpeed, usePlayback } from '../hooks/use-playback';
import { adjacentMomentStep, stepAfterKey } from '../lib/step-navigation';
import { nearestStep } from '../lib/time-scale';

export interface ScrubberProps {
  times: ArrayLike<number>;
  step: number;
  onStep: (step: number) => void;
  /** Flag starts, event and bookmark times (s), for the previous/next jumps. */
  moments: number[];
}

/**
 * The replay's time cursor: an ARIA slider (WAI-ARIA Authoring Practices, slider pattern) with
 * arrows for one step, Shift+arrows for one second, Home/End, Space to play or pause and [ / ]
 * for the previous or next flag or event.
 */
export function Scrubber({ times, step, onStep, moments }: ScrubberProps) {
  const labelId = useId();
  const {
    isPlaying,
    togglePlaying: onTogglePlay,
    speed,
    setSpeed: onSpeed,
  } = usePlayback(times, step, onStep);
  const last = Math.max(0, times.length - 1);
  const t = times[step] ?? 0;
  const jump = (direction: 1 | -1) => {
    const target = adjacentMomentStep(moments, times, step, direction);
    if (target !== null) onStep(target);
  };
  const hasPrevious = adjacentMomentStep(moments, times, step, -1) !== null;
  const hasNext = adjacentMomentStep(moments, times, step, 1) !== null;

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    if (event.key === ' ') {
      event.preventDefault();
      onTogglePlay();
      return;
    }
    if (event.key === '[' || event.key === ']') {
      event.preventDefault();
      jump(event.key === ']' ? 1 : -1);
      return;
    }
    const next = stepAfterKey(event.key, event.shiftKey, step, times);
    if (next === null) return;
    event.preventDefault();
    onStep(next);
  };
  const seekPointer = (event: PointerEvent<HTMLDivElement>) => {
    const rect = event.currentTarget.getBoundingClientRect();
    const fraction = Math.min(1, Math.max(0, (event.clientX - rect.left) / rect.width));
    onStep(nearestStep(times, times[0] + fraction * ((times[last] ?? 0) - (times[0] ?? 0))));
  };
  const fraction = last > 0 ? ((t - times[0]) / ((times[last] ?? 1) - times[0] || 1)) * 100 : 0;

  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button size="sm" icon={isPlaying ? Pause : Play} onClick={onTogglePlay} aria-pressed={isPlaying}>
        {isPlaying ? 'Pause' : 'Play'}
      </Button>
      <label className="flex items-center gap-1 text-sm">
        Speed
        <select
          className="rounded border border-canvas-line bg-canvas-raised px-1 py-0.5 text-sm"
          value={speed}
          onChange={(e) => onSpeed(Number(e.target.value) as PlaybackSpeed)}
        >
          {PLAYBACK_SPEEDS.map((s) => (
            <option key={s} value={s}>
              {s}×
            </option>
          ))}
        </select>
      </label>
      <Button
        size="sm"
        icon={SkipBack}
        onClick={() => jump(-1)}
        disabled={!hasPrevious}
        title="Previous flag, event or bookmark ( [ )"
      >
        Previous moment
      </Button>
      <Button
        size="sm"
        icon={SkipForward}
        onClick={() => jump(1)}
        disabled={!hasNext}
        title="Next flag, event or bookmark ( ] )"
      >
        Next moment
      </Button>
      <div className="flex min-w-64 flex-1 items-center gap-3">
        <span id={labelId} className="text-sm font-bold whitespace-nowrap">
          Replay time
        </span>
        <div
          role="slider"
          tabIndex={0}
          aria-labelledby={labelId}
          aria-valuemin={0}
          aria-valuemax={last}
          aria-valuenow={step}
          aria-valuetext={`${t.toFixed(2)} seconds, step ${step} of ${last}`}
          aria-keyshortcuts="ArrowLeft ArrowRight Shift+ArrowLeft Shift+ArrowRight Home End Space [ ]"
          data-testid="scrubber"
          onKeyDown={onKeyDown}
          onPointerDown={(event) => {
            try {
              event.currentTarget.setPointerCapture(event.pointerId);
            } catch {
              // A pointer the browser no longer tracks cannot be captured; seeking still works.
            }
            seekPointer(event);
          }}
          onPointerMove={(event) => event.buttons === 1 && seekPointer(event)}
          className="relative h-6 flex-1 cursor-pointer rounded outline-none focus-visible:ring-2 focus-visible:ring-accent"
        >
          <div className="absolute top-2.5 right-0 left-0 h-1 rounded bg-canvas-line" />
          <div
            className="absolute top-2.5 left-0 h-1 rounded bg-series-replay"
            style={{ width: `${fraction}%` }}
          />
          <div
            className="absolute top-0.5 size-5 -translate-x-1/2 rounded-full border-2 border-white bg-series-replay shadow"
            style={{ left: `${fraction}%` }}
          />
        </div>
      </div>
      <output className="text-sm whitespace-nowrap tabular-nums" data-testid="cursor-readout">
        {t.toFixed(2)} <span className="text-ink-muted">s</span> · step {step}{' '}
        <span className="text-ink-muted">/ {last}</span>
      </output>
    </div>
  );
}
