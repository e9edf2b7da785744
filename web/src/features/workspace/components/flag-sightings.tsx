import { ChevronLeft, ChevronRight } from 'lucide-react';
import { adjacentSighting, type Sighting, sightingIndexAt } from '../lib/sighting-navigation';

interface FlagSightingsProps {
  sightings: Sighting[];
  /** Current cursor time (s), to know which sighting is on screen. */
  time: number;
  onOpen: (time: number) => void;
}

/** The passes on which one unmapped object was seen, with previous / next to jump between them. */
export function FlagSightings({ sightings, time, onOpen }: FlagSightingsProps) {
  const current = sightingIndexAt(sightings, time);
  const previous = adjacentSighting(sightings, time, -1);
  const next = adjacentSighting(sightings, time, 1);
  return (
    <div className="mt-2 border-t border-canvas-sunk pt-2">
      <div className="flex items-center gap-1 text-xs">
        <span className="font-bold">
          {sightings.length} {sightings.length === 1 ? 'sighting' : 'sightings'}
        </span>
        <button
          type="button"
          disabled={!previous}
          onClick={() => previous && onOpen(previous.start)}
          className="ml-auto inline-flex items-center rounded px-1 hover:bg-canvas-sunk disabled:opacity-40"
        >
          <ChevronLeft aria-hidden className="size-3" /> Previous
        </button>
        <button
          type="button"
          disabled={!next}
          onClick={() => next && onOpen(next.start)}
          className="inline-flex items-center rounded px-1 hover:bg-canvas-sunk disabled:opacity-40"
        >
          Next <ChevronRight aria-hidden className="size-3" />
        </button>
      </div>
      <ol className="mt-1 max-h-32 overflow-y-auto text-xs tabular-nums" aria-label="Sightings">
        {sightings.map((sighting, index) => (
          <li key={sighting.start}>
            <button
              type="button"
              onClick={() => onOpen(sighting.start)}
              aria-current={index === current ? 'true' : undefined}
              className={`w-full rounded px-1 text-left hover:bg-canvas-sunk ${index === current ? 'font-bold' : ''}`}
            >
              {index + 1}. {sighting.start.toFixed(1)}–{sighting.end.toFixed(1)} s (
              {(sighting.end - sighting.start).toFixed(1)} s in view)
            </button>
          </li>
        ))}
      </ol>
    </div>
  );
}
