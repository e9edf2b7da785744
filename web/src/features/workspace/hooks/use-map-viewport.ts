import type { TBundleMap } from '@shared/contracts/bundle-views';
import { type PointerEvent, useCallback, useEffect, useRef, useState, type WheelEvent } from 'react';
import { fitViewport, type MapViewport, zoomAt } from '../lib/map-viewport';

/** Pan (drag), zoom (wheel and buttons) and follow-robot state of a map canvas. */
export function useMapViewport(
  map: TBundleMap,
  width: number,
  height: number,
  follow: { x: number; y: number } | null,
  initial?: MapViewport,
) {
  const [view, setView] = useState<MapViewport | null>(initial ?? null);
  const drag = useRef<{ x: number; y: number } | null>(null);
  const fitToMap = useCallback(
    () =>
      setView(
        fitViewport(map.origin, map.width * map.resolution, map.height * map.resolution, width, height),
      ),
    [map, width, height],
  );
  useEffect(() => {
    if (width > 0 && height > 0 && !view) fitToMap();
  }, [width, height, view, fitToMap]);
  const followX = follow?.x;
  const followY = follow?.y;
  useEffect(() => {
    if (followX === undefined || followY === undefined) return;
    setView((current) => (current ? { ...current, centerX: followX, centerY: followY } : current));
  }, [followX, followY]);

  const zoom = (factor: number, px = width / 2, py = height / 2) =>
    setView((current) => (current ? zoomAt(current, width, height, px, py, factor) : current));

  const handlers = {
    onWheel: (event: WheelEvent<HTMLCanvasElement>) => {
      const rect = event.currentTarget.getBoundingClientRect();
      zoom(event.deltaY < 0 ? 1.2 : 1 / 1.2, event.clientX - rect.left, event.clientY - rect.top);
    },
    onPointerDown: (event: PointerEvent<HTMLCanvasElement>) => {
      drag.current = { x: event.clientX, y: event.clientY };
      event.currentTarget.setPointerCapture(event.pointerId);
    },
    onPointerUp: () => {
      drag.current = null;
    },
    /** Returns true while dragging, so hover tooltips stay quiet during a pan. */
    dragTo: (event: PointerEvent<HTMLCanvasElement>): boolean => {
      if (!drag.current) return false;
      const dx = event.clientX - drag.current.x;
      const dy = event.clientY - drag.current.y;
      drag.current = { x: event.clientX, y: event.clientY };
      setView((current) =>
        current
          ? {
              ...current,
              centerX: current.centerX - dx / current.pxPerMetre,
              centerY: current.centerY + dy / current.pxPerMetre,
            }
          : current,
      );
      return true;
    },
  };
  return { view, zoom, fitToMap, handlers };
}
