/** What part of the map frame is on screen: the centre (m) and the zoom (px per m). */
export interface MapViewport {
  centerX: number;
  centerY: number;
  pxPerMetre: number;
}

/** Map frame (m, y north) to canvas pixels (y down) for a canvas of `width` x `height` CSS px. */
export function mapToScreen(
  view: MapViewport,
  width: number,
  height: number,
  x: number,
  y: number,
): [number, number] {
  return [
    width / 2 + (x - view.centerX) * view.pxPerMetre,
    height / 2 - (y - view.centerY) * view.pxPerMetre,
  ];
}

/** Canvas pixels back to the map frame (m). */
export function screenToMap(
  view: MapViewport,
  width: number,
  height: number,
  px: number,
  py: number,
): [number, number] {
  return [
    view.centerX + (px - width / 2) / view.pxPerMetre,
    view.centerY - (py - height / 2) / view.pxPerMetre,
  ];
}

/** The viewport that shows a `mapWidth` x `mapHeight` m area whose south-west corner is `origin`. */
export function fitViewport(
  origin: [number, number],
  mapWidth: number,
  mapHeight: number,
  width: number,
  height: number,
): MapViewport {
  const pxPerMetre = Math.max(1e-3, Math.min(width / mapWidth, height / mapHeight) * 0.95);
  return { centerX: origin[0] + mapWidth / 2, centerY: origin[1] + mapHeight / 2, pxPerMetre };
}

/** Zoom by `factor` keeping the map point under the pointer (px, py) fixed on screen. */
export function zoomAt(
  view: MapViewport,
  width: number,
  height: number,
  px: number,
  py: number,
  factor: number,
): MapViewport {
  const pxPerMetre = Math.min(2000, Math.max(0.5, view.pxPerMetre * factor));
  const [mx, my] = screenToMap(view, width, height, px, py);
  const applied = pxPerMetre / view.pxPerMetre;
  return {
    pxPerMetre,
    centerX: mx - (mx - view.centerX) / applied,
    centerY: my - (my - view.centerY) / applied,
  };
}

/**
 * A scale-bar length (m) from the 1-2-5 series that spans at most `maxPx` pixels, and its pixel
 * length (common practice for map scale bars).
 */
export function scaleBarLength(pxPerMetre: number, maxPx = 120): { metres: number; px: number } {
  const raw = maxPx / pxPerMetre;
  const decade = 10 ** Math.floor(Math.log10(raw));
  const metres = [5, 2, 1].map((m) => m * decade).find((m) => m <= raw) ?? decade;
  return { metres, px: metres * pxPerMetre };
}

/** Index of the particle nearest to the map point (x, y) within `radius` m, or -1. */
export function nearestParticle(
  xs: ArrayLike<number>,
  ys: ArrayLike<number>,
  x: number,
  y: number,
  radius: number,
): number {
  let best = -1;
  let bestDistance = radius * radius;
  for (let i = 0; i < xs.length; i++) {
    const d = (xs[i] - x) ** 2 + (ys[i] - y) ** 2;
    if (d <= bestDistance) {
      bestDistance = d;
      best = i;
    }
  }
  return best;
}
