import { useState } from 'react';
import type { TimeDomain } from '../lib/time-scale';

/** A bookmark of the replay on screen: its time (s since start_time) and what to call it. */
export interface TimelineBookmark {
  id: string;
  t: number;
  title: string;
}

interface TimelineBookmarksProps {
  bookmarks: readonly TimelineBookmark[];
  toPx: (t: number) => number;
  domain: TimeDomain;
  /** The row's top, px. */
  top: number;
  right: number;
  onSeekTime: (t: number) => void;
}

/** Same estimate as the flag labels': an over-estimate of a text-xs character, so nothing is cut. */
const CHAR_PX = 7;

/** The bookmarks row of the timeline's band: a marker per bookmark, its title on hover or focus. */
export function TimelineBookmarks({
  bookmarks,
  toPx,
  domain,
  top,
  right,
  onSeekTime,
}: TimelineBookmarksProps) {
  const [shownId, setShownId] = useState<string | null>(null);
  const inView = bookmarks.filter((b) => b.t >= domain.start && b.t <= domain.end);
  const shown = inView.find((b) => b.id === shownId);
  return (
    <g data-testid="timeline-bookmarks">
      <text x={8} y={top + 12} className="fill-ink-muted text-xs font-bold">
        Bookmarks
      </text>
      {inView.map((bookmark) => (
        // biome-ignore lint/a11y/useSemanticElements: an SVG shape cannot be a <button>.
        <g
          key={bookmark.id}
          role="button"
          tabIndex={0}
          data-testid="timeline-bookmark"
          data-t={bookmark.t}
          data-x={toPx(bookmark.t)}
          aria-label={`Bookmark at ${bookmark.t.toFixed(2)} s: ${bookmark.title}`}
          transform={`translate(${toPx(bookmark.t)}, ${top})`}
          onMouseEnter={() => setShownId(bookmark.id)}
          onMouseLeave={() => setShownId(null)}
          onFocus={() => setShownId(bookmark.id)}
          onBlur={() => setShownId(null)}
          onClick={() => onSeekTime(bookmark.t)}
          onKeyDown={(e) => e.key === 'Enter' && onSeekTime(bookmark.t)}
          className="cursor-pointer outline-none focus-visible:[&>path]:stroke-ink focus-visible:[&>path]:stroke-2"
        >
          {/* A pennant on a staff: the bookmark's time is the staff. */}
          <path d="M0 0 V16 M0 0 H9 L6 4 L9 8 H0" fill="#009E73" stroke="#00694d" strokeWidth={1} />
          <rect x={-5} y={0} width={14} height={16} fill="transparent" />
        </g>
      ))}
      {shown && (
        <BookmarkTitle
          x={toPx(shown.t)}
          top={top}
          right={right}
          title={`${shown.t.toFixed(2)} s · ${shown.title}`}
        />
      )}
    </g>
  );
}

/** The hovered bookmark's title beside its marker, on its left where it would run off the plot. */
function BookmarkTitle({ x, top, right, title }: { x: number; top: number; right: number; title: string }) {
  // A note can run to pages: the first line, shortened, is enough to tell bookmarks apart.
  const firstLine = title.split('\n')[0];
  const text = firstLine.length > 80 ? `${firstLine.slice(0, 79)}…` : firstLine;
  const width = text.length * CHAR_PX + 8;
  // Beside the marker, never over it: to its left where the right side has no room.
  const left = x + 12 + width <= right ? x + 12 : Math.max(0, x - 6 - width);
  return (
    <g
      data-testid="timeline-bookmark-title"
      className="pointer-events-none"
      transform={`translate(${left}, ${top})`}
    >
      <rect width={width} height={16} rx={3} fill="#fafbf8" stroke="#00694d" />
      <text x={4} y={12} className="fill-ink text-xs">
        {text}
      </text>
    </g>
  );
}
