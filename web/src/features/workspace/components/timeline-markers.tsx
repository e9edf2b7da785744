import type { TBundleTracks } from '@shared/contracts/bundle-views';
import type { TReplayFlag } from '@shared/contracts/replays';
import { FLAG_KIND_LABELS, FLAG_SEVERITY_LABELS, labelFor } from '@shared/human-labels';
import { useMemo } from 'react';
import { eventKindLabel, eventSymbolPath } from '../lib/event-symbols';
import { layoutFlagBand, type PlacedFlag } from '../lib/flag-band-layout';
import type { TimeDomain } from '../lib/time-scale';

/** Flag intensity by severity; the label carries the severity too, never the shade alone. */
const SEVERITY_OPACITY = { info: 0.25, warning: 0.5, critical: 0.85 } as const;
/** Height of one row of flags, px. */
export const FLAG_ROW_HEIGHT = 19;
/** An over-estimate of a text-xs character's width, so a label is given all the room it needs. */
const CHAR_PX = 7;

const flagLabel = (flag: TReplayFlag) =>
  `${labelFor(FLAG_KIND_LABELS, flag.kind)} · ${FLAG_SEVERITY_LABELS[flag.severity]}`;

/** The flags in view, each with its row and label position, and how many rows they take. */
export interface FlagBand {
  flags: (TReplayFlag & PlacedFlag & { x0: number; x1: number })[];
  rowCount: number;
}

/** Stacks the flags in view into rows so neither bars nor labels overlap or run off the plot. */
export function useFlagBand(
  flags: TReplayFlag[],
  toPx: (t: number) => number,
  domain: TimeDomain,
  left: number,
  right: number,
): FlagBand {
  return useMemo(() => {
    const inView = flags.filter((f) => f.end >= domain.start && f.start <= domain.end);
    const bars = inView.map((flag) => {
      const x0 = Math.max(left, toPx(flag.start));
      return {
        x0,
        x1: Math.max(x0 + 3, Math.min(right, toPx(flag.end))),
        labelWidth: flagLabel(flag).length * CHAR_PX,
      };
    });
    const { placed, rowCount } = layoutFlagBand(bars, left, right);
    return { flags: inView.map((flag, i) => ({ ...flag, ...bars[i], ...placed[i] })), rowCount };
  }, [flags, toPx, domain, left, right]);
}

interface TimelineMarkersProps {
  band: FlagBand;
  events: TBundleTracks['events'];
  toPx: (t: number) => number;
  domain: TimeDomain;
  /** The events row's baseline, px (below the flags' rows). */
  eventsY: number;
  onHover: (flag: TReplayFlag | null) => void;
  onSeekTime: (t: number) => void;
}

/** The band above the tracks: flags as vermillion intervals, bundle events as shaped markers. */
export function TimelineMarkers({
  band,
  events,
  toPx,
  domain,
  eventsY,
  onHover,
  onSeekTime,
}: TimelineMarkersProps) {
  return (
    <>
      <text x={8} y={14} className="fill-ink-muted text-xs font-bold">
        Flags
      </text>
      <text x={8} y={eventsY + 4} className="fill-ink-muted text-xs font-bold">
        Events
      </text>
      {band.flags.map((flag) => {
        const top = 4 + flag.row * FLAG_ROW_HEIGHT;
        return (
          // biome-ignore lint/a11y/useSemanticElements: an SVG shape cannot be a <button>.
          <g
            key={`${flag.kind}-${flag.start}-${flag.end}`}
            role="button"
            tabIndex={0}
            data-testid="timeline-flag"
            data-row={flag.row}
            aria-label={`Flag ${labelFor(FLAG_KIND_LABELS, flag.kind)}, ${FLAG_SEVERITY_LABELS[flag.severity]}, ${flag.start.toFixed(1)} to ${flag.end.toFixed(1)} s: ${flag.evidence}`}
            onMouseEnter={() => onHover(flag)}
            onMouseLeave={() => onHover(null)}
            onFocus={() => onHover(flag)}
            onBlur={() => onHover(null)}
            onClick={() => onSeekTime(flag.start)}
            onKeyDown={(e) => e.key === 'Enter' && onSeekTime(flag.start)}
            className="cursor-pointer outline-none focus-visible:[&>rect]:stroke-ink"
          >
            <rect
              x={flag.x0}
              y={top}
              width={flag.x1 - flag.x0}
              height={16}
              fill="#D55E00"
              fillOpacity={SEVERITY_OPACITY[flag.severity]}
              stroke="#D55E00"
              strokeWidth={1}
            />
            <text x={flag.labelX} y={top + 12} className="pointer-events-none fill-ink text-xs">
              {flagLabel(flag)}
            </text>
          </g>
        );
      })}
      {events
        .filter((e) => e.t >= domain.start && e.t <= domain.end)
        .map((event) => (
          <path
            key={`${event.t}-${event.kind}-${event.detail}`}
            d={eventSymbolPath(event.kind)}
            transform={`translate(${toPx(event.t)}, ${eventsY})`}
            fill="#CC79A7"
            stroke="#7a3f63"
            strokeWidth={0.8}
          >
            <title>{`${eventKindLabel(event.kind)} at ${event.t.toFixed(2)} s${event.detail ? `: ${event.detail}` : ''}`}</title>
          </path>
        ))}
    </>
  );
}
