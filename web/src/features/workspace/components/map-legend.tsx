import { SERIES_COLOURS } from '../lib/map-drawing';

const ITEMS = [
  { colour: SERIES_COLOURS.replay, label: 'Replay particles, mean and 95 % ellipse' },
  { colour: SERIES_COLOURS.onboard, label: 'Onboard estimate' },
  { colour: SERIES_COLOURS.reference, label: 'Reference' },
  { colour: SERIES_COLOURS.scan, label: 'Scan endpoints' },
  { colour: '#22262c', label: 'Occupied' },
  { colour: '#d6d9dd', label: 'Unknown' },
];

/** Colour key for the map, the same colours as the timeline. */
export function MapLegend() {
  return (
    <ul aria-label="Map legend" className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-muted">
      {ITEMS.map((item) => (
        <li key={item.label} className="flex items-center gap-1.5">
          <span
            aria-hidden
            className="inline-block size-3 rounded-sm border border-canvas-line"
            style={{ background: item.colour }}
          />
          {item.label}
        </li>
      ))}
    </ul>
  );
}
