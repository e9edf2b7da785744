import type { TReplay } from '@shared/contracts/replays';
import { ErrorState, SkeletonBar } from '@web/components/states';
import { type ReactNode, useCallback, useDeferredValue, useMemo, useRef, useState } from 'react';
import { useReplayCauses, useReplaySafety } from '../api/get-replay-detail';
import { useReplayStep } from '../api/get-replay-step';
import { useReplayViewData } from '../hooks/use-replay-view-data';
import { useSafetyOverlay } from '../hooks/use-safety-overlay';
import { useSafetyTrackSpecs } from '../hooks/use-safety-track-specs';
import { useViewportHeight } from '../hooks/use-viewport-height';
import type { Picture } from '../lib/make-picture';
import type { MapViewState } from '../lib/map-view-state';
import { nearestStep } from '../lib/time-scale';
import { CausesPanel } from './causes-panel';
import { FlagsPanel } from './flags-panel';
import { MapView } from './map-view';
import { MomentLink } from './moment-link';
import { PictureExportBar } from './picture-export-bar';
import { SafetyPanel } from './safety-panel';
import { Scrubber } from './scrubber';
import { type SidePanelTab, SidePanelTabs } from './side-panel-tabs';
import { Timeline } from './timeline';
import type { TimelineBookmark } from './timeline-bookmarks';

/**
 * Room the map leaves in the window for what sits around it: the app's header, the page title and
 * replay list, the scrubber, the map's caption and legend, and the timeline's flags and first
 * tracks, so at 1280x800 all of them are on screen together (#12: an instrument's layout).
 */
const MAP_SURROUNDINGS_PX = 570;
const MAP_HEIGHT = { min: 220, max: 420 };

/** The moment on screen, handed to side-panel content (e.g. "pin this moment"). */
export interface WorkspaceMoment {
  replayId: string;
  step: number;
  /** s since start_time */
  time: number;
  /** The map view on screen; null until the map has been laid out. */
  view: MapViewState | null;
}

export interface ReplayWorkspaceProps {
  bundleId: string;
  replay: TReplay;
  /** Extra side-panel tabs after "Flags" (bookmarks, SQL console), given the current moment. */
  extraTabs?: (moment: WorkspaceMoment, seekTime: (t: number) => void) => SidePanelTab[];
  /** Opens at this step and map view (e.g. a bookmark). */
  initialStep?: number;
  /** Opens at the step nearest this time, s (a deep link); `initialStep` wins when both are given. */
  initialTime?: number;
  /** More moments for Previous/Next besides flag starts and events (e.g. bookmark times, s). */
  extraMoments?: readonly number[];
  /** This replay's bookmarks, drawn on the timeline. */
  bookmarks?: readonly TimelineBookmark[];
  initialView?: MapViewState;
  /** Controls placed beside the scrubber (e.g. a "pin this moment" button). */
  toolbar?: (moment: WorkspaceMoment) => ReactNode;
  /** Stores an exported picture in the case (shown as "Save … to case" when given). */
  onSavePicture?: (picture: Picture) => Promise<string>;
}

/** A finished replay: scrubber, map view and timeline sharing one cursor, and the side panel. */
export function ReplayWorkspace({
  bundleId,
  replay,
  extraTabs,
  initialStep,
  initialTime,
  initialView,
  toolbar,
  extraMoments,
  bookmarks,
  onSavePicture,
}: ReplayWorkspaceProps) {
  const viewsRef = useRef<HTMLDivElement>(null);
  const viewportHeight = useViewportHeight();
  const mapHeight = Math.round(
    Math.max(MAP_HEIGHT.min, Math.min(MAP_HEIGHT.max, viewportHeight - MAP_SURROUNDINGS_PX)),
  );
  const data = useReplayViewData(bundleId, replay.id);
  const times = (data.series?.columns.t ?? []) as number[];
  const [step, setStep] = useState<number | null>(null);
  const [mapView, setMapView] = useState<MapViewState | null>(initialView ?? null);
  const openedAt =
    initialStep ?? (initialTime !== undefined && times.length ? nearestStep(times, initialTime) : 0);
  const current = step ?? openedAt;
  // The slider follows the pointer at once; the map, timeline and side panel render the cursor
  // when the browser has time, so a fast drag never queues hundreds of full renders.
  const shownStep = useDeferredValue(current);
  const last = Math.max(0, times.length - 1);
  const particles = useReplayStep(replay.id, Math.min(current, last), last);
  const safety = useReplaySafety(replay.id);
  const causes = useReplayCauses(replay.id);
  const safetyTracks = useSafetyTrackSpecs(safety.data);
  const drawOverlay = useSafetyOverlay(safety.data, data.map?.footprint, data.tracks, data.series, current);
  const seekTime = useCallback((t: number) => setStep(Math.max(0, nearestStep(times, t))), [times]);
  const moments = useMemo(
    () => [
      ...replay.flags.map((f) => f.start),
      ...(data.tracks?.events.map((e) => e.t) ?? []),
      ...(extraMoments ?? []),
    ],
    [replay.flags, data.tracks, extraMoments],
  );

  if (data.error)
    return <ErrorState error={data.error} title="Could not load this replay" onRetry={data.retry} />;
  if (data.isLoading || !data.series || !data.map) {
    return (
      <div aria-busy className="space-y-3 p-4" data-testid="workspace-loading">
        <p className="text-sm text-ink-muted">Loading the replay's series and the map…</p>
        <SkeletonBar className="h-64 w-full" />
        <SkeletonBar className="h-40 w-full" />
      </div>
    );
  }
  const time = times[current] ?? 0;
  const moment = { replayId: replay.id, step: current, time, view: mapView };
  const shownTime = times[shownStep] ?? 0;
  const shownMoment = { ...moment, step: shownStep, time: shownTime };
  return (
    <div className="grid grid-cols-[minmax(0,1fr)_18rem] gap-4">
      <div ref={viewsRef} className="min-w-0 space-y-2">
        {/* Sticky, so the current time and step stay on screen while reading the timeline. */}
        <div
          data-testid="workspace-controls"
          className="sticky top-0 z-20 rounded-lg border border-canvas-line bg-canvas-raised px-3 py-2 shadow-sm"
        >
          <Scrubber times={times} step={current} onStep={setStep} moments={moments} />
        </div>
        <MapView
          map={data.map}
          tracks={data.tracks}
          replayId={replay.id}
          particles={particles.data}
          time={shownTime}
          targetStep={shownStep}
          height={mapHeight}
          initialView={initialView}
          onViewChange={setMapView}
          drawOverlay={drawOverlay}
        />
        {particles.error && (
          <p className="text-sm text-state-bad">
            Particles at step {particles.target}: {particles.error.message}
          </p>
        )}
        <div className="rounded-lg border border-canvas-line bg-canvas-raised p-2">
          <Timeline
            series={data.series}
            tracks={data.tracks}
            // The analysis's clearance (map and scans) replaces the older map-only track.
            clearance={safety.data ? undefined : data.clearance}
            extraTracks={safetyTracks}
            flags={replay.flags}
            step={shownStep}
            onSeek={setStep}
            bookmarks={bookmarks}
          />
        </div>
        {/* Below the views it draws: exporting is occasional, the scrubber is used all the time. */}
        <PictureExportBar
          source={() => viewsRef.current && { container: viewsRef.current, replay, times }}
          onSave={onSavePicture}
        />
      </div>
      <aside
        aria-label="Workspace side panel"
        className="rounded-lg border border-canvas-line bg-canvas-raised p-3"
      >
        {/* Here rather than under the scrubber: one row less above the map at 1280x800. */}
        <div className="mb-2 flex flex-wrap items-center gap-2">
          {toolbar?.(moment)}
          <MomentLink bundleId={bundleId} replayId={replay.id} time={time} />
        </div>
        <SidePanelTabs
          tabs={[
            {
              id: 'flags',
              label: `Flags (${replay.flags.length})`,
              content: <FlagsPanel flags={replay.flags} time={time} onOpen={seekTime} />,
            },
            {
              id: 'causes',
              label: `Probable causes (${causes.data?.length ?? 0})`,
              content: <CausesPanel causes={causes.isError ? null : causes.data} onOpen={seekTime} />,
            },
            {
              id: 'safety',
              label: 'Separation and stopping',
              content: (
                <SafetyPanel safety={safety.isError ? null : safety.data} step={current} onOpen={seekTime} />
              ),
            },
            ...(extraTabs?.(shownMoment, seekTime) ?? []),
          ]}
        />
      </aside>
    </div>
  );
}
