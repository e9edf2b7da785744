import type { useMapMeasure } from '../hooks/use-map-measure';
import type { MapViewport } from '../lib/map-viewport';
import { mapToScreen } from '../lib/map-viewport';

interface MapMeasureOverlayProps {
  view: MapViewport;
  /** The canvas's size, CSS px. */
  size: { width: number; height: number };
  measure: Pick<ReturnType<typeof useMapMeasure>, 'pointer' | 'points' | 'distance'>;
}

/** Over the map: the pointer's map coordinates in a corner, and the measured line with its length. */
export function MapMeasureOverlay({ view, size, measure }: MapMeasureOverlayProps) {
  const { width, height } = size;
  const { pointer, points, distance } = measure;
  const screen = points.map((p) => mapToScreen(view, width, height, p.x, p.y));
  return (
    <>
      {screen.length > 0 && (
        <svg aria-hidden className="pointer-events-none absolute inset-0" width={width} height={height}>
          {screen.length === 2 && (
            <line
              x1={screen[0][0]}
              y1={screen[0][1]}
              x2={screen[1][0]}
              y2={screen[1][1]}
              stroke="#1f2328"
              strokeWidth={2}
              strokeDasharray="6 3"
            />
          )}
          {screen.map(([x, y], index) => (
            // biome-ignore lint/suspicious/noArrayIndexKey: at most two points, in click order.
            <circle key={index} cx={x} cy={y} r={4} fill="#fff" stroke="#1f2328" strokeWidth={2} />
          ))}
        </svg>
      )}
      <div
        data-testid="map-readout"
        aria-live="polite"
        className="pointer-events-none absolute right-12 bottom-2 rounded bg-white/85 px-1.5 py-0.5 text-xs tabular-nums"
      >
        {pointer ? (
          <span data-testid="map-pointer" data-x={pointer.x} data-y={pointer.y}>
            x {pointer.x.toFixed(2)} <span className="text-ink-muted">m</span>, y {pointer.y.toFixed(2)}{' '}
            <span className="text-ink-muted">m</span>
          </span>
        ) : (
          <span className="text-ink-muted">Point at the map for coordinates</span>
        )}
        {distance !== null && (
          <span data-testid="map-distance" data-metres={distance} className="ml-2 font-bold">
            Distance {distance.toFixed(2)} <span className="font-normal text-ink-muted">m</span>
          </span>
        )}
        {points.length === 1 && <span className="ml-2 text-ink-muted">click the second point</span>}
      </div>
    </>
  );
}
