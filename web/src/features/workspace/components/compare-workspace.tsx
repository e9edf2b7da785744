import type { TReplay } from '@shared/contracts/replays';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { useMemo, useState } from 'react';
import { useReplayStep } from '../api/get-replay-step';
import { useReplayViewData } from '../hooks/use-replay-view-data';
import { nearestStep } from '../lib/time-scale';
import { ComparisonTable } from './comparison-table';
import { MapView } from './map-view';
import { Scrubber } from './scrubber';
import { Timeline } from './timeline';

/** One side of the comparison: its own map and timeline at the shared cursor time. */
function ComparePane({
  bundleId,
  replay,
  time,
  onSeekTime,
  title,
}: {
  bundleId: string;
  replay: TReplay;
  time: number;
  onSeekTime: (t: number) => void;
  title: string;
}) {
  const data = useReplayViewData(bundleId, replay.id);
  const times = (data.series?.columns.t ?? []) as number[];
  const step = times.length ? Math.max(0, nearestStep(times, time)) : 0;
  const particles = useReplayStep(replay.id, step, Math.max(0, times.length - 1));
  if (data.error)
    return <ErrorState error={data.error} title="Could not load this replay" onRetry={data.retry} />;
  if (!data.series || !data.map) return <SkeletonBar className="h-80 w-full" />;
  return (
    <section
      aria-label={title}
      className="min-w-0 space-y-2 rounded-lg border border-canvas-line bg-canvas-raised p-3"
    >
      <h2 className="text-base font-bold">
        {title}: {replay.label || 'Untitled replay'}{' '}
        <span className="text-xs font-normal text-ink-muted tabular-nums">step {step}</span>
      </h2>
      <MapView
        map={data.map}
        tracks={data.tracks}
        replayId={replay.id}
        particles={particles.data}
        time={time}
        targetStep={particles.target}
        label={`${title} map`}
        height={340}
      />
      <Timeline
        series={data.series}
        tracks={data.tracks}
        clearance={data.clearance}
        flags={replay.flags}
        step={step}
        onSeek={(k) => onSeekTime(times[k])}
        label={`${title} timeline`}
      />
    </section>
  );
}

/** Two replays of one bundle side by side with one shared time cursor, and what differs. */
export function CompareWorkspace({
  bundleId,
  left,
  right,
}: {
  bundleId: string;
  left: TReplay;
  right: TReplay;
}) {
  const leftData = useReplayViewData(bundleId, left.id);
  const times = (leftData.series?.columns.t ?? []) as number[];
  const [step, setStep] = useState(0);
  const moments = useMemo(
    () =>
      [...left.flags, ...right.flags]
        .map((f) => f.start)
        .concat(leftData.tracks?.events.map((e) => e.t) ?? []),
    [left.flags, right.flags, leftData.tracks],
  );
  const time = times[step] ?? 0;
  const seekTime = (t: number) => setStep(Math.max(0, nearestStep(times, t)));
  return (
    <div className="space-y-4">
      <div className="sticky top-0 z-20 rounded-lg border border-canvas-line bg-canvas-raised p-3 shadow-sm">
        <Scrubber times={times} step={step} onStep={setStep} moments={moments} />
      </div>
      <div className="grid grid-cols-2 gap-4">
        <ComparePane bundleId={bundleId} replay={left} time={time} onSeekTime={seekTime} title="Left" />
        <ComparePane bundleId={bundleId} replay={right} time={time} onSeekTime={seekTime} title="Right" />
      </div>
      <section
        aria-labelledby="comparison-title"
        className="rounded-lg border border-canvas-line bg-canvas-raised p-4"
      >
        <h2 id="comparison-title" className="text-base font-bold">
          Settings and outcome
        </h2>
        <ComparisonTable left={left} right={right} />
      </section>
    </div>
  );
}
