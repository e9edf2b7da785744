import { describe, expect, it } from 'vitest';
import {
  clearanceAlong,
  footprintReach,
  odometrySpeed,
} from '../../../../api/src/services/bundles/bundle-views';
import { CELL_FREE, CELL_OCCUPIED, type OccupancyGrid } from '../../../../shared/bundle/types';

/** A 20 x 10 grid of 0.1 m cells, free except one occupied cell at row 2, column 15. */
function gridWithOneObstacle(): OccupancyGrid {
  const width = 20;
  const height = 10;
  const cells = new Uint8Array(width * height).fill(CELL_FREE);
  cells[2 * width + 15] = CELL_OCCUPIED;
  return { resolution: 0.1, width, height, origin: [0, 0], cells };
}

describe('footprint clearance along a replay', () => {
  it('is the Euclidean cell-centre distance to the obstacle minus the footprint reach', () => {
    // Cell (i, j) has its centre at x = (j + 0.5) * 0.1, y = (height - i - 0.5) * 0.1 (bundle format).
    // Obstacle cell (2, 15): centre (1.55, 0.75). Pose in cell (5, 11): centre (1.15, 0.45).
    // Distance by Pythagoras: cells (3, 4) apart -> 5 cells = 0.5 m (a 3-4-5 right triangle).
    const grid = gridWithOneObstacle();
    const [clearance] = clearanceAlong(grid, 0.2, [1.15], [0.45]);
    expect(clearance).toBeCloseTo(0.5 - 0.2, 9);
  });

  it('is negative when the footprint overlaps the obstacle and null off the grid or undefined', () => {
    const grid = gridWithOneObstacle();
    const values = clearanceAlong(grid, 0.35, [1.55, 5, null, Number.NaN], [0.75, 5, 0.5, 0.5]);
    expect(values[0]).toBeCloseTo(-0.35, 9);
    expect(values.slice(1)).toEqual([null, null, null]);
  });

  it('measures a circle by its radius and a rectangle by its half-width', () => {
    expect(footprintReach({ shape: 'circle', radius: 0.35 })).toBe(0.35);
    expect(footprintReach({ shape: 'rectangle', length: 1.2, width: 0.7 })).toBeCloseTo(0.35, 12);
  });
});

describe('odometry speed', () => {
  it('is distance over time between consecutive readings, skipping repeated stamps', () => {
    // A 3-4-5 step of 0.5 m in 0.25 s is 2 m/s (worked by hand).
    const t = Float64Array.from([0, 0.25, 0.25, 0.75]);
    const x = Float64Array.from([0, 0.3, 0.3, 0.3]);
    const y = Float64Array.from([0, 0.4, 0.4, 0.4]);
    const speed = odometrySpeed({ t, x, y, theta: new Float64Array(4) });
    expect(speed.t).toEqual([0.25, 0.75]);
    expect(speed.speed[0]).toBeCloseTo(2, 9);
    expect(speed.speed[1]).toBe(0);
  });
});
