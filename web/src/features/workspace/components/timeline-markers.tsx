import type { TBundleTracks } from '@shared/contracts/bundle-views';
import type { TReplayFlag } from '@shared/contracts/replays';
import { FLAG_KIND_LABELS, FLAG_SEVERITY_LABELS, labelFor } from '@shared/human-labels';
import { eventKindLabel, eventSymbolPath } from '../lib/event-symbols';
import type { TimeDomain } from '../lib/time-scale';

/** Flag intensity by severity; the label carries the severity too, never the shade alone. */
const SEVERITY_OPACITY = { info: 0.25, warning: 0.5, critical: 0.85 } as const;

interface TimelineMarkersProps {
  flags: TReplayFlag[];
  events: TBundleTracks['events'];
  toPx: (t: number) => number;
  domain: TimeDomain;
  left: number;
  right: number;
  onHover: (flag: TReplayFlag | null) => void;
  onSeekTime: (t: number) => void;
}

/** The band above the tracks: flags as vermillion intervals, bundle events as shaped markers. */
export function TimelineMarkers({
  flags,
  events,
  toPx,
  domain,
  left,
  right,
  onHover,
  onSeekTime,
}: TimelineMarkersProps) {
  const isInView = (t0: number, t1: number) => t1 >= domain.start && t0 <= domain.end;
  return (
    <>
      <text x={8} y={14} className="fill-ink-muted text-xs font-bold">
        Flags
      </text>
      <text x={8} y={36} className="fill-ink-muted text-xs font-bold">
        Events
      </text>
      {flags
        .filter((f) => isInView(f.start, f.end))
        .map((flag) => {
          const x0 = Math.max(left, toPx(flag.start));
          const x1 = Math.min(right, toPx(flag.end));
          return (
            // biome-ignore lint/a11y/useSemanticElements: an SVG shape cannot be a <button>.
            <g
              key={`${flag.kind}-${flag.start}-${flag.end}`}
              role="button"
              tabIndex={0}
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
                x={x0}
                y={4}
                width={Math.max(3, x1 - x0)}
                height={16}
                fill="#D55E00"
                fillOpacity={SEVERITY_OPACITY[flag.severity]}
                stroke="#D55E00"
                strokeWidth={1}
              />
              {x1 - x0 > 60 && (
                <text x={x0 + 4} y={16} className="pointer-events-none fill-ink text-xs">
                  {labelFor(FLAG_KIND_LABELS, flag.kind)} · {FLAG_SEVERITY_LABELS[flag.severity]}
                </text>
              )}
            </g>
          );
        })}
      {events
        .filter((e) => isInView(e.t, e.t))
        .map((event) => (
          <path
            key={`${event.t}-${event.kind}-${event.detail}`}
            d={eventSymbolPath(event.kind)}
            transform={`translate(${toPx(event.t)}, 32)`}
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
