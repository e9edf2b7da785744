import type { TBundleMap, TBundleTracks } from '@shared/contracts/bundle-views';
import type { TReplayStepResponse } from '@shared/contracts/replays';
import { Button } from '@web/components/button';
import { Crosshair, Maximize, Minus, Plus, Ruler } from 'lucide-react';
import { memo, useEffect, useMemo, useRef, useState } from 'react';
import { useReplayDisagreement } from '../api/get-replay-disagreement';
import { useElementWidth } from '../hooks/use-element-width';
import { useMapMeasure } from '../hooks/use-map-measure';
import { useMapViewport } from '../hooks/use-map-viewport';
import {
  drawCovarianceEllipse,
  drawFootprint,
  drawLandmarks,
  drawParticles,
  drawPose,
  drawScanEndpoints,
  type Frame,
  gridImage,
  SERIES_COLOURS,
} from '../lib/map-drawing';
import { MAP_PALETTE } from '../lib/map-palette';
import { HEATMAP_LAYER, HEATMAP_MOMENT_LAYER, type HeatMode, type MapViewState } from '../lib/map-view-state';
import { mapToScreen, nearestParticle, scaleBarLength, screenToMap } from '../lib/map-viewport';
import { momentDisagreement } from '../lib/moment-disagreement';
import { poseAtTime } from '../lib/pose-at-time';
import { MapLegend } from './map-legend';
import { MapMeasureOverlay } from './map-measure-overlay';

export interface MapViewProps {
  map: TBundleMap;
  tracks: TBundleTracks | undefined;
  replayId: string;
  /** The particle set on screen (may lag the cursor by a step while the next one loads). */
  particles: TReplayStepResponse | undefined;
  /** Cursor time, s since start_time. */
  time: number;
  /** The cursor's step; when the particle set on screen is another step, the map says so. */
  targetStep?: number;
  label?: string;
  height?: number;
  /** Restores a pinned view (e.g. from a bookmark). */
  initialView?: MapViewState;
  /** Told whenever the view changes, so the moment can be pinned with it. */
  onViewChange?: (view: MapViewState) => void;
  /** Drawn last on every frame (e.g. the separation and stopping overlay). */
  drawOverlay?: (frame: Frame) => void;
}

/** Canvas view of the map with the replay's belief, the onboard and reference poses at the cursor. */
// Memoised: the workspace re-renders on every cursor move, these only when their inputs change.
export const MapView = memo(function MapView({
  map,
  tracks,
  replayId,
  particles,
  time,
  targetStep,
  label = 'Map',
  height = 420,
  initialView,
  onViewChange,
  drawOverlay,
}: MapViewProps) {
  const [containerRef, width] = useElementWidth<HTMLDivElement>();
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const [isFollowing, setIsFollowing] = useState(initialView?.followRobot ?? false);
  const [heatMode, setHeatMode] = useState<HeatMode>(
    initialView?.layers?.includes(HEATMAP_MOMENT_LAYER)
      ? 'moment'
      : initialView?.layers?.includes(HEATMAP_LAYER)
        ? 'replay'
        : 'off',
  );
  const showHeat = heatMode !== 'off';
  const [hover, setHover] = useState<{ px: number; py: number; index: number } | null>(null);
  const [drawnCount, setDrawnCount] = useState(0);
  const measure = useMapMeasure();
  const heat = useReplayDisagreement(replayId, heatMode === 'replay');
  const momentHeat = useMemo(
    () => (heatMode === 'moment' && particles ? momentDisagreement(map, particles.scanEndpoints) : undefined),
    [heatMode, particles, map],
  );
  const heatCounts = heatMode === 'moment' ? momentHeat : heatMode === 'replay' ? heat.data : undefined;
  const follow = isFollowing && particles ? particles.mean : null;
  const { view, zoom, fitToMap, handlers } = useMapViewport(
    map,
    width,
    height,
    follow,
    initialView && {
      centerX: initialView.centerX,
      centerY: initialView.centerY,
      pxPerMetre: initialView.zoom,
    },
  );
  const onViewChangeRef = useRef(onViewChange);
  onViewChangeRef.current = onViewChange;
  useEffect(() => {
    if (!view) return;
    onViewChangeRef.current?.({
      centerX: view.centerX,
      centerY: view.centerY,
      zoom: view.pxPerMetre,
      followRobot: isFollowing,
      layers: [
        'particles',
        'scan',
        ...(heatMode === 'replay' ? [HEATMAP_LAYER] : heatMode === 'moment' ? [HEATMAP_MOMENT_LAYER] : []),
      ],
    });
  }, [view, isFollowing, heatMode]);
  const onboard = useMemo(() => poseAtTime(tracks?.onboard, time), [tracks, time]);
  const reference = useMemo(() => poseAtTime(tracks?.reference, time), [tracks, time]);

  // The grid is drawn once into an offscreen canvas, then scaled on every frame.
  const gridCanvas = useMemo(() => {
    if (!map.rows) return null;
    const canvas = document.createElement('canvas');
    canvas.width = map.width;
    canvas.height = map.height;
    canvas.getContext('2d')?.putImageData(gridImage(map.rows, map.width, heatCounts), 0, 0);
    return canvas;
  }, [map, heatCounts]);

  const background = useMemo(() => {
    if (!view || width === 0) return null;
    const ratio = window.devicePixelRatio || 1;
    const canvas = document.createElement('canvas');
    canvas.width = width * ratio;
    canvas.height = height * ratio;
    const ctx = canvas.getContext('2d');
    if (!ctx) return null;
    ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
    ctx.fillStyle = MAP_PALETTE.surround;
    ctx.fillRect(0, 0, width, height);
    const f = { ctx, view, width, height };
    if (gridCanvas) {
      const [x0, y0] = mapToScreen(
        view,
        width,
        height,
        map.origin[0],
        map.origin[1] + map.height * map.resolution,
      );
      ctx.imageSmoothingEnabled = false;
      ctx.drawImage(
        gridCanvas,
        x0,
        y0,
        map.width * map.resolution * view.pxPerMetre,
        map.height * map.resolution * view.pxPerMetre,
      );
    }
    drawLandmarks(f, map.landmarks);
    return canvas;
  }, [view, width, height, gridCanvas, map]);

  // One pending animation frame draws the latest inputs; a newer render replaces the inputs
  // rather than cancelling the frame, so fast scrubbing never starves the canvas.
  const drawRef = useRef<(() => void) | null>(null);
  const pendingFrame = useRef(0);
  useEffect(() => () => cancelAnimationFrame(pendingFrame.current), []);
  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas || !view || width === 0) return;
    drawRef.current = () => {
      const drawStart = performance.now();
      const ratio = window.devicePixelRatio || 1;
      if (canvas.width !== width * ratio) canvas.width = width * ratio;
      if (canvas.height !== height * ratio) canvas.height = height * ratio;
      const ctx = canvas.getContext('2d');
      if (!ctx) return;
      // The grid and landmarks change only with the view: copy them 1:1, then draw the belief.
      ctx.setTransform(1, 0, 0, 1, 0, 0);
      if (background) ctx.drawImage(background, 0, 0);
      ctx.setTransform(ratio, 0, 0, ratio, 0, 0);
      const f = { ctx, view, width, height };
      let count = 0;
      if (particles) {
        drawScanEndpoints(f, particles.scanEndpoints);
        count = drawParticles(f, particles);
        drawCovarianceEllipse(f, particles);
        drawFootprint(f, map.footprint, particles.mean.x, particles.mean.y, particles.mean.theta);
        drawPose(f, particles.mean.x, particles.mean.y, particles.mean.theta, SERIES_COLOURS.replay);
      }
      if (reference) drawPose(f, reference.x, reference.y, reference.theta, SERIES_COLOURS.reference, 4);
      if (onboard) drawPose(f, onboard.x, onboard.y, onboard.theta, SERIES_COLOURS.onboard, 4);
      drawOverlay?.(f);
      canvas.dataset.drawnStep = String(particles?.step ?? -1);
      setDrawnCount(count);
      // Frame timestamps for the scrub benchmark (performance timeline).
      performance.mark('map-frame', { detail: { drawMs: performance.now() - drawStart } });
    };
    if (!pendingFrame.current) {
      pendingFrame.current = requestAnimationFrame(() => {
        pendingFrame.current = 0;
        drawRef.current?.();
      });
    }
  }, [view, width, height, background, map, particles, onboard, reference, drawOverlay]);

  const bar = view ? scaleBarLength(view.pxPerMetre) : null;
  const drawnStep = particles?.step ?? null;
  const isStale = targetStep !== undefined && drawnStep !== targetStep;
  const hovered = hover && particles && hover.index >= 0 ? hover : null;

  return (
    <figure aria-label={label} className="relative m-0">
      <div ref={containerRef} className="relative overflow-hidden rounded-md border border-canvas-line">
        <canvas
          ref={canvasRef}
          role="img"
          aria-label={`${label}: occupancy grid with the replay's particles at ${time.toFixed(2)} s; drag to pan, wheel to zoom`}
          data-testid="map-canvas"
          data-particle-count={drawnCount}
          style={{ width, height, touchAction: 'none' }}
          className={`block ${measure.isMeasuring ? 'cursor-crosshair' : 'cursor-grab active:cursor-grabbing'}`}
          onWheel={handlers.onWheel}
          // While measuring, a press places a point instead of starting a pan.
          onPointerDown={measure.isMeasuring ? undefined : handlers.onPointerDown}
          onPointerUp={handlers.onPointerUp}
          onClick={(event) => {
            if (!measure.isMeasuring || !view) return;
            const rect = event.currentTarget.getBoundingClientRect();
            const [x, y] = screenToMap(
              view,
              width,
              height,
              event.clientX - rect.left,
              event.clientY - rect.top,
            );
            measure.addPoint({ x, y });
          }}
          onPointerLeave={() => {
            setHover(null);
            measure.setPointer(null);
          }}
          onPointerMove={(event) => {
            if (handlers.dragTo(event)) {
              setIsFollowing(false);
              return;
            }
            if (!view) return;
            const rect = event.currentTarget.getBoundingClientRect();
            const px = event.clientX - rect.left;
            const py = event.clientY - rect.top;
            const [mx, my] = screenToMap(view, width, height, px, py);
            measure.setPointer({ x: mx, y: my });
            if (!particles) return;
            setHover({
              px,
              py,
              index: nearestParticle(particles.x, particles.y, mx, my, 6 / view.pxPerMetre),
            });
          }}
        />
        {hovered && particles && (
          <div
            role="tooltip"
            className="pointer-events-none absolute z-10 rounded border border-canvas-line bg-canvas-raised px-2 py-1 text-xs tabular-nums shadow"
            style={{ left: Math.min(hovered.px + 12, width - 180), top: hovered.py + 12 }}
          >
            Particle {hovered.index + 1}: x {particles.x[hovered.index].toFixed(2)}{' '}
            <span className="text-ink-muted">m</span>, y {particles.y[hovered.index].toFixed(2)}{' '}
            <span className="text-ink-muted">m</span>, θ{' '}
            {((particles.theta[hovered.index] * 180) / Math.PI).toFixed(1)}
            <span className="text-ink-muted">°</span>, weight{' '}
            {particles.weight[hovered.index].toExponential(2)}
          </div>
        )}
        <div
          data-testid="map-step-label"
          data-drawn-step={drawnStep ?? -1}
          aria-live="polite"
          className={`absolute top-2 left-2 rounded px-1.5 py-0.5 text-xs tabular-nums ${
            isStale ? 'border border-state-warn bg-amber-50 font-bold text-ink' : 'bg-white/85 text-ink-muted'
          }`}
        >
          {drawnStep === null
            ? `Loading step ${targetStep ?? 0}…`
            : isStale
              ? `Showing step ${drawnStep} · loading step ${targetStep}…`
              : `Belief at step ${drawnStep}`}
        </div>
        {isStale && drawnStep !== null && (
          <div aria-hidden className="pointer-events-none absolute inset-0 bg-canvas/40" />
        )}
        {bar && (
          <div
            data-testid="scale-bar"
            // Read by the picture export, which draws the same bar into the file.
            data-px={bar.px}
            data-metres={bar.metres}
            className="absolute bottom-2 left-2 rounded bg-white/85 px-1.5 py-0.5 text-xs"
          >
            <div className="h-1.5 border-x-2 border-b-2 border-ink" style={{ width: bar.px }} />
            <span className="sr-only">Scale bar: </span>
            {bar.metres} <span className="text-ink-muted">m</span>
          </div>
        )}
        {view && <MapMeasureOverlay view={view} size={{ width, height }} measure={measure} />}
        <div className="absolute top-2 right-2 flex flex-col gap-1">
          <Button
            size="sm"
            icon={Ruler}
            variant={measure.isMeasuring ? 'primary' : 'secondary'}
            aria-pressed={measure.isMeasuring}
            aria-label="Measure"
            title="Measure: click two points on the map (Escape clears)"
            onClick={measure.toggleMeasuring}
          />
          <Button size="sm" icon={Plus} aria-label="Zoom in" title="Zoom in" onClick={() => zoom(1.5)} />
          <Button
            size="sm"
            icon={Minus}
            aria-label="Zoom out"
            title="Zoom out"
            onClick={() => zoom(1 / 1.5)}
          />
          <Button
            size="sm"
            icon={Maximize}
            aria-label="Show the whole map"
            title="Show the whole map"
            onClick={fitToMap}
          />
        </div>
      </div>
      <figcaption className="mt-2 flex flex-wrap items-center gap-x-4 gap-y-1 text-sm">
        <label className="flex items-center gap-1.5">
          <input type="checkbox" checked={isFollowing} onChange={(e) => setIsFollowing(e.target.checked)} />
          <Crosshair aria-hidden className="size-4" /> Follow robot
        </label>
        <label className="flex items-center gap-1.5">
          Map disagreement
          <select
            value={heatMode}
            onChange={(e) => setHeatMode(e.target.value as HeatMode)}
            className="rounded border border-canvas-line bg-canvas-raised px-1 py-0.5 text-sm"
          >
            <option value="off">not shown</option>
            <option value="moment">at this moment</option>
            <option value="replay">whole replay</option>
          </select>
          {heatMode === 'replay' && heat.isFetching && <span className="text-ink-muted">(loading…)</span>}
          {heatMode === 'replay' && heat.isError && (
            <span className="text-state-bad">(not available: {heat.error.message})</span>
          )}
        </label>
        <span className="text-ink-muted tabular-nums">
          {particles
            ? `${drawnCount} of ${particles.count} particles drawn (step ${particles.step})`
            : 'Loading particles…'}
        </span>
      </figcaption>
      <div className="mt-1">
        <MapLegend heat={showHeat ? { counts: heatCounts, mode: heatMode } : undefined} />
      </div>
    </figure>
  );
});
