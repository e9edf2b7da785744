import { useCallback, useEffect, useState } from 'react';

/** A point in the map frame, m. */
export interface MapPoint {
  x: number;
  y: number;
}

/**
 * The map's pointer readout and measuring tool: where the pointer is (map m) and, while measuring,
 * up to two clicked points. Escape or switching the tool off clears the measurement.
 */
export function useMapMeasure() {
  const [pointer, setPointer] = useState<MapPoint | null>(null);
  const [isMeasuring, setIsMeasuring] = useState(false);
  const [points, setPoints] = useState<MapPoint[]>([]);

  const stopMeasuring = useCallback(() => {
    setIsMeasuring(false);
    setPoints([]);
  }, []);
  const toggleMeasuring = () => (isMeasuring ? stopMeasuring() : setIsMeasuring(true));

  useEffect(() => {
    if (!isMeasuring) return;
    const onKey = (event: KeyboardEvent) => event.key === 'Escape' && stopMeasuring();
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [isMeasuring, stopMeasuring]);

  /** A third click starts a new measurement, so the tool never needs clearing by hand. */
  const addPoint = (point: MapPoint) =>
    setPoints((current) => (current.length >= 2 ? [point] : [...current, point]));

  const distance =
    points.length === 2 ? Math.hypot(points[1].x - points[0].x, points[1].y - points[0].y) : null;
  return { pointer, setPointer, isMeasuring, toggleMeasuring, points, addPoint, distance };
}
