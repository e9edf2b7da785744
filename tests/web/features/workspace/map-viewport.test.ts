import { describe, expect, it } from 'vitest';
import {
  fitViewport,
  mapToScreen,
  nearestParticle,
  scaleBarLength,
  screenToMap,
  zoomAt,
} from '../../../../web/src/features/workspace/lib/map-viewport';

describe('map viewport', () => {
  const view = { centerX: 12, centerY: 7, pxPerMetre: 25 };

  it('maps the map frame to the screen and back (y north up, screen y down)', () => {
    const [px, py] = mapToScreen(view, 800, 400, 14, 9);
    expect(px).toBeCloseTo(400 + 2 * 25, 9);
    expect(py).toBeCloseTo(200 - 2 * 25, 9);
    const [x, y] = screenToMap(view, 800, 400, px, py);
    expect(x).toBeCloseTo(14, 9);
    expect(y).toBeCloseTo(9, 9);
  });

  it('keeps the point under the pointer fixed when zooming (common practice for wheel zoom)', () => {
    const before = screenToMap(view, 800, 400, 123, 321);
    const zoomed = zoomAt(view, 800, 400, 123, 321, 1.7);
    const after = screenToMap(zoomed, 800, 400, 123, 321);
    expect(after[0]).toBeCloseTo(before[0], 9);
    expect(after[1]).toBeCloseTo(before[1], 9);
    expect(zoomed.pxPerMetre).toBeCloseTo(25 * 1.7, 9);
  });

  it('fits a 30 m x 20 m map inside the canvas', () => {
    const fitted = fitViewport([0, 0], 30, 20, 600, 400);
    const [left] = mapToScreen(fitted, 600, 400, 0, 0);
    const [right] = mapToScreen(fitted, 600, 400, 30, 0);
    expect(left).toBeGreaterThanOrEqual(0);
    expect(right).toBeLessThanOrEqual(600);
  });

  it('picks a 1-2-5 scale bar no longer than the space allowed', () => {
    // 1-2-5 series of round lengths: common practice on map scale bars.
    expect(scaleBarLength(25, 120)).toEqual({ metres: 2, px: 50 });
    expect(scaleBarLength(10, 120).metres).toBe(10);
    expect(scaleBarLength(300, 120).metres).toBeCloseTo(0.2, 12);
  });

  it('finds the particle under the pointer, or none outside the radius', () => {
    const xs = [0, 1, 2];
    const ys = [0, 1, 2];
    expect(nearestParticle(xs, ys, 1.05, 0.98, 0.2)).toBe(1);
    expect(nearestParticle(xs, ys, 5, 5, 0.2)).toBe(-1);
  });
});
