import type { TBundleTracks } from '@shared/contracts/bundle-views';
import type { TReplayFlag, TReplaySeriesResponse } from '@shared/contracts/replays';
import { FLAG_KIND_LABELS, FLAG_SEVERITY_LABELS, labelFor } from '@shared/human-labels';
import { InfoButton } from '@web/components/info-button';
import { axisBottom, brushX, scaleLinear, select } from 'd3';
import { memo, useEffect, useMemo, useRef, useState } from 'react';
import { useElementWidth } from '../hooks/use-element-width';
import { type TrackSpec, useTrackSpecs } from '../hooks/use-track-specs';
import { clampDomain, createTimeScale, nearestStep, type TimeDomain } from '../lib/time-scale';
import { buildTrackPath, markerPositions } from '../lib/track-path';
import { formatReadoutValue, readTracksAt } from '../lib/track-readout';
import { type TimelineBookmark, TimelineBookmarks } from './timeline-bookmarks';
import { FLAG_ROW_HEIGHT, TimelineMarkers, useFlagBand } from './timeline-markers';

const LEFT = 168;
/** Tracks whose term has an explanation on the Help page (glossary ids). */
const TRACK_TERMS: Record<string, string> = { ess: 'ess', loglik: 'loglik' };
const RIGHT = 16;
const TRACK_HEIGHT = 46;
const TRACK_GAP = 10;
/** Height of the events row and of the bookmarks row under the flags' rows, px. */
const MARKER_ROW_HEIGHT = 22;

export interface TimelineProps {
  series: TReplaySeriesResponse;
  tracks: TBundleTracks | undefined;
  clearance: (number | null)[] | undefined;
  flags: TReplayFlag[];
  step: number;
  onSeek: (step: number) => void;
  /** Accessible name, to tell two timelines apart on the comparison page. */
  label?: string;
  /** Tracks added below the replay's own (e.g. the separation and stopping analysis). */
  extraTracks?: TrackSpec[];
  /** This replay's bookmarks, drawn in their own row; clicking one seeks to it. */
  bookmarks?: readonly TimelineBookmark[];
}

const formatValue = (v: number) =>
  Math.abs(v) >= 100 ? v.toFixed(0) : Math.abs(v) >= 1 ? v.toFixed(1) : v.toFixed(2);

/** Stacked diagnostic tracks over the replay's time, with events, flags, zoom brush and cursor. */
// Memoised: the workspace re-renders on every cursor move, these only when their inputs change.
export const Timeline = memo(function Timeline({
  series,
  tracks,
  clearance,
  flags,
  step,
  onSeek,
  label = 'Replay timeline',
  extraTracks,
  bookmarks = [],
}: TimelineProps) {
  const [containerRef, width] = useElementWidth<HTMLDivElement>();
  const axisRef = useRef<SVGGElement>(null);
  const brushRef = useRef<SVGGElement>(null);
  const times = series.columns.t as number[];
  const full = useMemo<TimeDomain>(() => ({ start: times[0] ?? 0, end: times.at(-1) ?? 0 }), [times]);
  const [domain, setDomain] = useState<TimeDomain>(full);
  const [hovered, setHovered] = useState<TReplayFlag | null>(null);
  /** The pointer's x (px) over the tracks, for the readout; null when it is elsewhere. */
  const [pointerX, setPointerX] = useState<number | null>(null);
  useEffect(() => setDomain(full), [full]);
  const ownSpecs = useTrackSpecs(series, tracks, clearance);
  const specs = useMemo(
    () => (extraTracks?.length ? [...ownSpecs, ...extraTracks] : ownSpecs),
    [ownSpecs, extraTracks],
  );
  const plotWidth = Math.max(50, width - LEFT - RIGHT);
  const scale = useMemo(() => createTimeScale(domain, LEFT, LEFT + plotWidth), [domain, plotWidth]);
  const flagBand = useFlagBand(flags, scale.toPx, domain, LEFT, LEFT + plotWidth);
  // Flags stack into as many rows as they need; events, bookmarks and the axis go below them.
  const flagsHeight = Math.max(1, flagBand.rowCount) * FLAG_ROW_HEIGHT + 4;
  const bookmarksTop = flagsHeight + MARKER_ROW_HEIGHT;
  // The bookmarks row is drawn only when there is something to draw, to keep the tracks high up.
  const bandHeight = bookmarksTop + (bookmarks.length ? MARKER_ROW_HEIGHT : 0);
  const tracksTop = bandHeight + 24;
  const height = tracksTop + specs.length * (TRACK_HEIGHT + TRACK_GAP) + 4;
  const seekRef = useRef(onSeek);
  seekRef.current = onSeek;

  useEffect(() => {
    if (!axisRef.current || width === 0) return;
    const axisScale = scaleLinear()
      .domain([scale.domain.start, scale.domain.end])
      .range([LEFT, LEFT + plotWidth]);
    const ticks = Math.max(2, Math.floor(plotWidth / 90));
    select(axisRef.current).call(
      axisBottom(axisScale)
        .ticks(ticks)
        .tickFormat((v) => `${v} s`),
    );
  }, [scale.domain.start, scale.domain.end, plotWidth, width]);

  useEffect(() => {
    if (!brushRef.current || width === 0) return;
    const group = select(brushRef.current);
    const brush = brushX<unknown>()
      .extent([
        [LEFT, tracksTop],
        [LEFT + plotWidth, height],
      ])
      .on('end', (event) => {
        const selection = event.selection as [number, number] | null;
        if (selection) {
          setDomain(
            clampDomain({ start: scale.toTime(selection[0]), end: scale.toTime(selection[1]) }, full),
          );
          group.call(brush.move, null);
        } else if (event.sourceEvent && 'offsetX' in event.sourceEvent) {
          // A click without a drag moves the cursor there.
          const k = nearestStep(times, scale.toTime((event.sourceEvent as MouseEvent).offsetX));
          if (k >= 0) seekRef.current(k);
        }
      });
    group.call(brush);
    return () => {
      group.on('.brush', null);
    };
  }, [width, plotWidth, height, tracksTop, scale, full, times]);

  const resamplingTicks = useMemo(
    () => markerPositions(times, (k) => (series.columns.resampled[k] ?? 0) > 0, domain, scale.toPx),
    [times, series, domain, scale],
  );
  // Tracks depend on the zoom only, not on the cursor: scrubbing must not rebuild them.
  const trackElements = useMemo(
    () => (
      <>
        {specs.map((spec, index) => {
          const top = tracksTop + index * (TRACK_HEIGHT + TRACK_GAP);
          const geometries = spec.lines.map((line) =>
            buildTrackPath(line.times, line.values, domain, plotWidth, TRACK_HEIGHT, scale.toPx),
          );
          const extents = geometries.flatMap((g) => (g.extent ? g.extent : []));
          const low = extents.length ? Math.min(...extents, spec.rule?.value ?? Number.POSITIVE_INFINITY) : 0;
          const high = extents.length
            ? Math.max(...extents, spec.rule?.value ?? Number.NEGATIVE_INFINITY)
            : 1;
          const shared = spec.lines.map((line) =>
            buildTrackPath(line.times, line.values, domain, plotWidth, TRACK_HEIGHT, scale.toPx, [low, high]),
          );
          const ruleY = spec.rule
            ? TRACK_HEIGHT - ((spec.rule.value - low) / (high - low || 1)) * TRACK_HEIGHT
            : null;
          return (
            <g key={spec.id} transform={`translate(0, ${top})`} data-track={spec.id}>
              <rect x={LEFT} y={0} width={plotWidth} height={TRACK_HEIGHT} fill="#fafbf8" stroke="#d9dcd4" />
              <text x={8} y={14} className="fill-ink text-xs font-bold">
                {spec.label}
              </text>
              {/* The gutter holds the unit's first words; the readout at the pointer gives all of it. */}
              <text x={8} y={28} className="fill-ink-muted text-xs">
                {spec.unit.split(',')[0]}
                <title>{spec.unit}</title>
              </text>
              {extents.length > 0 && (
                <>
                  {[0, TRACK_HEIGHT / 2, TRACK_HEIGHT].map((y) => (
                    <line key={y} x1={LEFT - 3} x2={LEFT} y1={y} y2={y} stroke="#5a6472" />
                  ))}
                  <text x={LEFT - 4} y={10} textAnchor="end" className="fill-ink-muted text-xs tabular-nums">
                    {formatValue(high)}
                  </text>
                  <text
                    x={LEFT - 4}
                    y={TRACK_HEIGHT / 2 + 4}
                    textAnchor="end"
                    className="fill-ink-muted text-xs tabular-nums"
                  >
                    {formatValue((low + high) / 2)}
                  </text>
                  <text
                    x={LEFT - 4}
                    y={TRACK_HEIGHT}
                    textAnchor="end"
                    className="fill-ink-muted text-xs tabular-nums"
                  >
                    {formatValue(low)}
                  </text>
                </>
              )}
              {ruleY !== null && Number.isFinite(ruleY) && (
                <line
                  x1={LEFT}
                  x2={LEFT + plotWidth}
                  y1={ruleY}
                  y2={ruleY}
                  stroke="#5a6472"
                  strokeDasharray="4 3"
                >
                  <title>{spec.rule?.label}</title>
                </line>
              )}
              {spec.id === 'ess' &&
                resamplingTicks.map((x) => (
                  <line
                    key={x}
                    x1={x}
                    x2={x}
                    y1={TRACK_HEIGHT - 5}
                    y2={TRACK_HEIGHT}
                    stroke="#0072B2"
                    strokeOpacity={0.6}
                  />
                ))}
              {shared.map((g, i) => (
                <path
                  key={spec.lines[i].colour}
                  d={g.path}
                  fill="none"
                  stroke={spec.lines[i].colour}
                  strokeWidth={1.3}
                  strokeDasharray={spec.lines[i].dashed ? '3 2' : undefined}
                />
              ))}
              <TrackLegend lines={spec.lines} right={LEFT + plotWidth - 4} />
              {extents.length === 0 && (
                <text x={LEFT + 8} y={TRACK_HEIGHT / 2 + 4} className="fill-ink-faint text-xs italic">
                  no data for this track
                </text>
              )}
            </g>
          );
        })}
      </>
    ),
    [specs, domain, plotWidth, scale, tracksTop, resamplingTicks],
  );
  const cursorX = scale.toPx(times[step] ?? 0);

  return (
    <div
      ref={containerRef}
      className="relative w-full"
      onPointerMove={(event) => {
        const box = event.currentTarget.getBoundingClientRect();
        const x = event.clientX - box.left;
        const y = event.clientY - box.top;
        setPointerX(x >= LEFT && x <= LEFT + plotWidth && y >= tracksTop ? x : null);
      }}
      onPointerLeave={() => setPointerX(null)}
    >
      {/* biome-ignore lint/a11y/useSemanticElements: an SVG cannot be a fieldset; the group holds the focusable flags. */}
      <svg
        role="group"
        aria-label={`${label}: diagnostics over time; drag to zoom, double-click to show everything`}
        width={width}
        height={height}
        className="block select-none text-ink"
        onDoubleClick={() => setDomain(full)}
        data-testid="timeline"
        data-drawn-steps={times.length}
        // Read by the picture export, which draws the cursor (an HTML overlay here) into the file.
        data-cursor-step={step}
        data-cursor-x={cursorX}
      >
        <g ref={axisRef} transform={`translate(0, ${bandHeight + 2})`} className="text-xs text-ink-muted" />
        <TimelineMarkers
          band={flagBand}
          events={tracks?.events ?? []}
          toPx={scale.toPx}
          domain={domain}
          eventsY={flagsHeight + 12}
          onHover={setHovered}
          onSeekTime={(t) => onSeek(Math.max(0, nearestStep(times, t)))}
        />
        {bookmarks.length > 0 && (
          <TimelineBookmarks
            bookmarks={bookmarks}
            toPx={scale.toPx}
            domain={domain}
            top={bookmarksTop}
            right={LEFT + plotWidth}
            onSeekTime={(t) => onSeek(Math.max(0, nearestStep(times, t)))}
          />
        )}
        {trackElements}
        {/* The zoom brush is a control: exported pictures leave it out. */}
        <g ref={brushRef} data-picture-skip="" />
      </svg>
      {cursorX >= LEFT && cursorX <= LEFT + plotWidth && (
        // A separate element, so moving the cursor does not repaint the whole SVG.
        <div
          aria-hidden
          data-testid="timeline-cursor"
          className="pointer-events-none absolute top-0 w-0.5 bg-ink"
          style={{ height, transform: `translateX(${cursorX - 1}px)`, left: 0, willChange: 'transform' }}
        />
      )}
      {pointerX !== null && !hovered && (
        <TrackReadoutBox
          specs={specs}
          time={scale.toTime(pointerX)}
          x={pointerX}
          height={height}
          alignRight={pointerX > LEFT + plotWidth / 2}
        />
      )}
      {hovered && (
        <div
          role="tooltip"
          className="pointer-events-none absolute top-6 left-36 z-10 max-w-md rounded-md border border-canvas-line bg-canvas-raised p-2 text-xs shadow-md"
        >
          <p className="font-bold">
            {labelFor(FLAG_KIND_LABELS, hovered.kind)} · {FLAG_SEVERITY_LABELS[hovered.severity]} ·{' '}
            {hovered.start.toFixed(1)}–{hovered.end.toFixed(1)}{' '}
            <span className="font-normal text-ink-muted">s</span>
          </p>
          <p className="mt-1 text-ink-muted">{hovered.evidence}</p>
        </div>
      )}
      {specs.map((spec, index) =>
        TRACK_TERMS[spec.id] ? (
          // An HTML overlay beside the track's unit: an SVG label cannot hold a button.
          <span
            key={spec.id}
            className="absolute"
            style={{
              left: 8 + spec.unit.split(',')[0].length * 7 + 6,
              top: tracksTop + index * (TRACK_HEIGHT + TRACK_GAP) + 18,
            }}
          >
            <InfoButton term={TRACK_TERMS[spec.id]} />
          </span>
        ) : null,
      )}
      {(domain.start !== full.start || domain.end !== full.end) && (
        <button
          type="button"
          className="absolute top-0 right-4 rounded border border-canvas-line bg-canvas-raised px-2 text-xs"
          onClick={() => setDomain(full)}
        >
          Show whole replay
        </button>
      )}
    </div>
  );
});

/** Each line's name beside its stroke, at the top right of its track: the track's legend. */
function TrackLegend({ lines, right }: { lines: TrackSpec['lines']; right: number }) {
  let x = right;
  const placed = [...lines].reverse().map((line) => {
    const width = line.name.length * 6 + 22;
    x -= width;
    return { line, x };
  });
  return (
    <g data-testid="track-legend" aria-hidden>
      {placed.map(({ line, x: at }) => (
        <g key={line.name} transform={`translate(${at}, 9)`}>
          {/* A backing so the names stay readable over a busy curve. */}
          <rect x={-3} y={-9} width={line.name.length * 6 + 22} height={12} fill="#fafbf8" opacity={0.85} />
          <line
            x1={0}
            x2={14}
            y1={-3}
            y2={-3}
            stroke={line.colour}
            strokeWidth={2}
            strokeDasharray={line.dashed ? '3 2' : undefined}
          />
          <text x={18} y={0} className="fill-ink-muted" style={{ fontSize: 10 }}>
            {line.name}
          </text>
        </g>
      ))}
    </g>
  );
}

/** The pointer's time and every track's value there, beside a thin line at the pointer. */
function TrackReadoutBox({
  specs,
  time,
  x,
  height,
  alignRight,
}: {
  specs: TrackSpec[];
  time: number;
  x: number;
  height: number;
  alignRight: boolean;
}) {
  const readout = readTracksAt(specs, time);
  return (
    <>
      <div
        aria-hidden
        className="pointer-events-none absolute top-0 w-px bg-ink-muted"
        style={{ height, left: x }}
      />
      <div
        role="status"
        aria-label="Values at the pointer"
        data-testid="timeline-readout"
        className="pointer-events-none absolute top-8 z-10 min-w-48 rounded-md border border-canvas-line bg-canvas-raised p-2 text-xs tabular-nums shadow-md"
        style={alignRight ? { right: `calc(100% - ${x - 8}px)` } : { left: x + 8 }}
      >
        <p className="font-bold" data-testid="readout-time">
          {time.toFixed(2)} s
        </p>
        {readout.map((track) => (
          <p key={track.id} data-track={track.id}>
            <span className="text-ink-muted">{track.label}: </span>
            {track.lines
              .map((line) =>
                track.lines.length > 1
                  ? `${line.name} ${formatReadoutValue(line.value)}`
                  : formatReadoutValue(line.value),
              )
              .join(' · ')}{' '}
            <span className="text-ink-muted">{track.unit}</span>
          </p>
        ))}
      </div>
    </>
  );
}
