import { describe, expect, it } from 'vitest';
import { castScan } from '../../../tools/simulator/laser-scanner';
import { castRay } from '../../../tools/simulator/ray-cast';
import { createGrid, fillBox } from '../../../tools/simulator/sim-grid';

// Geometry, common practice: a ray from (x0, y0) at angle a meets the vertical line x = xw after
// (xw - x0) / cos(a) and the horizontal line y = yw after (yw - y0) / sin(a).
describe('castRay', () => {
  const grid = createGrid(10, 6, 0.05);
  fillBox(grid, 7.0, 0, 10, 6); // wall whose west face is the line x = 7.0
  fillBox(grid, 0, 5.0, 7.0, 6); // wall whose south face is the line y = 5.0

  it.each([0, 0.1, -0.3, 0.35, -0.38, 0.2])('hits the x = 7 wall face at angle %f rad', (angle) => {
    const [x0, y0] = [1.234, 2.571];
    const expected = (7.0 - x0) / Math.cos(angle);
    expect(castRay(grid, x0, y0, angle, 20)).toBeCloseTo(expected, 9);
  });

  it.each([Math.PI / 2, 1.9, 1.4])('hits the y = 5 wall face at angle %f rad', (angle) => {
    const [x0, y0] = [3.11, 1.07];
    const expected = (5.0 - y0) / Math.sin(angle);
    expect(castRay(grid, x0, y0, angle, 20)).toBeCloseTo(expected, 9);
  });

  it('reports no return when the wall lies beyond the maximum range', () => {
    expect(castRay(grid, 1, 2, 0, 5.9)).toBe(Number.POSITIVE_INFINITY);
    expect(castRay(grid, 1, 2, 0, 6.1)).toBeCloseTo(6, 9);
  });

  it('returns 0 from inside an occupied cell and Infinity out of an open grid edge', () => {
    expect(castRay(grid, 8, 2, 0, 10)).toBe(0);
    expect(castRay(grid, 1, 2, Math.PI, 10)).toBe(Number.POSITIVE_INFINITY);
  });

  it('casts scan beams from the sensor mount, not the robot centre', () => {
    const geometry = {
      mount: [0.2, 0, 0] as [number, number, number],
      angle_min: -0.1,
      angle_increment: 0.1,
      beams: 3,
      range_min: 0.05,
      range_max: 12,
    };
    const ranges = castScan(grid, { x: 2, y: 2, theta: 0 }, geometry);
    // Sensor at x = 2.2: the straight-ahead beam (k = 1) travels 4.8 m to x = 7.
    expect(ranges[1]).toBeCloseTo(4.8, 9);
    expect(ranges[0]).toBeCloseTo(4.8 / Math.cos(-0.1), 9);
  });
});
