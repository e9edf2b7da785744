import { SERIES_COLOURS } from '../lib/map-drawing';
import { MAP_PALETTE } from '../lib/map-palette';
import type { HeatMode } from '../lib/map-view-state';

type Swatch = 'dot' | 'ring' | 'cell' | 'hatch' | 'tick';

const ITEMS: { colour: string; label: string; swatch: Swatch }[] = [
  { colour: SERIES_COLOURS.replay, label: 'Replay belief: particles, mean, 95 % ellipse', swatch: 'dot' },
  { colour: SERIES_COLOURS.onboard, label: 'Onboard estimate (what the robot believed)', swatch: 'ring' },
  { colour: SERIES_COLOURS.reference, label: 'Reference (independent truth)', swatch: 'ring' },
  { colour: SERIES_COLOURS.scan, label: 'Scan endpoints', swatch: 'tick' },
  { colour: MAP_PALETTE.occupied, label: 'Occupied cell', swatch: 'cell' },
  { colour: MAP_PALETTE.free, label: 'Free cell', swatch: 'cell' },
  { colour: MAP_PALETTE.unknown, label: 'Unknown cell', swatch: 'hatch' },
];

function SwatchMark({ colour, swatch }: { colour: string; swatch: Swatch }) {
  if (swatch === 'dot')
    return <span aria-hidden className="inline-block size-2.5 rounded-full" style={{ background: colour }} />;
  if (swatch === 'ring')
    return (
      <span
        aria-hidden
        className="inline-block size-3 rounded-full border-2"
        style={{ borderColor: colour }}
      />
    );
  if (swatch === 'tick')
    return <span aria-hidden className="inline-block h-0.5 w-3" style={{ background: colour }} />;
  const hatch =
    swatch === 'hatch'
      ? `repeating-linear-gradient(135deg, ${MAP_PALETTE.unknownHatch} 0 1px, ${colour} 1px 4px)`
      : colour;
  return (
    <span
      aria-hidden
      className="inline-block size-3 border"
      style={{ background: hatch, borderColor: MAP_PALETTE.occupied }}
    />
  );
}

export interface MapLegendProps {
  /** The heat map on screen, for its scale (counts per cell, and which span they cover). */
  heat?: { counts: Uint32Array | undefined; mode: HeatMode };
}

/** Driftcase's key for the map (swatch, word, unit), the same colours as the timeline. */
export function MapLegend({ heat }: MapLegendProps) {
  let heatMax = 0;
  if (heat?.counts) for (const c of heat.counts) if (c > heatMax) heatMax = c;
  return (
    <div className="flex flex-wrap items-center gap-x-4 gap-y-1">
      <ul aria-label="Map legend" className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
        {ITEMS.map((item) => (
          <li key={item.label} className="flex items-center gap-1.5">
            <SwatchMark colour={item.colour} swatch={item.swatch} />
            {item.label}
          </li>
        ))}
      </ul>
      {heat && (
        <figure
          aria-label="Map disagreement scale"
          className="m-0 flex items-center gap-1.5 text-xs text-ink-muted"
        >
          <span>Map disagreement {heat.mode === 'moment' ? 'at this step' : 'over the replay'}:</span>
          <span className="tabular-nums">1</span>
          <span
            aria-hidden
            className="inline-block h-2.5 w-20 border border-canvas-line"
            style={{ background: `linear-gradient(90deg, ${MAP_PALETTE.free}, ${MAP_PALETTE.heat})` }}
          />
          <span className="tabular-nums">{heatMax || '–'}</span>
          <span>scan endpoints on a free cell</span>
        </figure>
      )}
    </div>
  );
}
