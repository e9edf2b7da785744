import { describe, expect, it } from 'vitest';
import type { Footprint, OccupancyGrid } from '../../../shared/bundle/types';
import { CELL_FREE, CELL_OCCUPIED } from '../../../shared/bundle/types';
import { createParticleState } from '../../../shared/engine/particle-state';
import { gridContactShare } from '../../../shared/safety/contact-probability';
import { buildObstacleField, footprintToGrid } from '../../../shared/safety/grid-clearance';
import { footprintToPoints, travelToPoints } from '../../../shared/safety/scan-returns';

/** Small seeded generator (mulberry32, a published 32-bit PRNG) so the random maps repeat. */
function mulberry32(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function randomGrid(random: () => number, density: number): OccupancyGrid {
  const width = 40;
  const height = 30;
  const cells = new Uint8Array(width * height);
  for (let c = 0; c < cells.length; c++) cells[c] = random() < density ? CELL_OCCUPIED : CELL_FREE;
  return { resolution: 0.1, width, height, origin: [-1, 0.5], cells };
}

/**
 * Brute force, independent of the code under test: the footprint's distance to a cell is the
 * smallest distance from densely sampled points of the cell's square (edges and inside) to the
 * footprint, each measured in the robot frame with the textbook point-to-circle / point-to-box
 * formula. Sampling every res/100 bounds its error by res/100.
 */
function bruteForce(grid: OccupancyGrid, footprint: Footprint, x: number, y: number, theta: number): number {
  const c = Math.cos(theta);
  const s = Math.sin(theta);
  const samples = 100;
  let best = Number.POSITIVE_INFINITY;
  for (let i = 0; i < grid.height; i++) {
    for (let j = 0; j < grid.width; j++) {
      if (grid.cells[i * grid.width + j] !== CELL_OCCUPIED) continue;
      const x0 = grid.origin[0] + j * grid.resolution;
      const y0 = grid.origin[1] + (grid.height - 1 - i) * grid.resolution;
      for (let a = 0; a <= samples; a++) {
        for (let b = 0; b <= samples; b += a === 0 || a === samples ? 1 : samples) {
          const px = x0 + (a / samples) * grid.resolution - x;
          const py = y0 + (b / samples) * grid.resolution - y;
          const lx = c * px + s * py;
          const ly = -s * px + c * py;
          let d: number;
          if (footprint.shape === 'circle') d = Math.max(0, Math.hypot(lx, ly) - footprint.radius);
          else
            d = Math.hypot(
              Math.max(0, Math.abs(lx) - footprint.length / 2),
              Math.max(0, Math.abs(ly) - footprint.width / 2),
            );
          if (d < best) best = d;
        }
      }
    }
  }
  return best;
}

const FOOTPRINTS: Footprint[] = [
  { shape: 'circle', radius: 0.35 },
  { shape: 'rectangle', length: 0.9, width: 0.5 },
];

describe('footprint-to-grid clearance', () => {
  for (const footprint of FOOTPRINTS) {
    it(`matches brute force on random maps (${footprint.shape})`, () => {
      const random = mulberry32(footprint.shape === 'circle' ? 11 : 12);
      for (let trial = 0; trial < 24; trial++) {
        const grid = randomGrid(random, 0.01 + 0.03 * random());
        const field = buildObstacleField(grid);
        const x = grid.origin[0] + 0.5 + random() * 3;
        const y = grid.origin[1] + 0.5 + random() * 2;
        const theta = (random() * 2 - 1) * Math.PI;
        const measured = footprintToGrid(field, footprint, x, y, theta);
        expect(measured).not.toBeNull();
        // Tolerance: the brute force's sampling step (res / 100 = 0.001 m).
        expect(Math.abs((measured as number) - bruteForce(grid, footprint, x, y, theta))).toBeLessThan(
          0.0011,
        );
      }
    });
  }

  it('is null off the grid and for a map without obstacles', () => {
    const grid = randomGrid(mulberry32(3), 0.02);
    expect(footprintToGrid(buildObstacleField(grid), FOOTPRINTS[0], -50, 0, 0)).toBeNull();
    const empty = { ...grid, cells: new Uint8Array(grid.cells.length) };
    expect(footprintToGrid(buildObstacleField(empty), FOOTPRINTS[0], 1, 1.5, 0)).toBeNull();
  });
});

describe('footprint-to-points clearance and free travel', () => {
  for (const footprint of FOOTPRINTS) {
    it(`matches brute force on random points (${footprint.shape})`, () => {
      const random = mulberry32(footprint.shape === 'circle' ? 21 : 22);
      for (let trial = 0; trial < 50; trial++) {
        const points = Array.from({ length: 20 }, () => (random() * 2 - 1) * 3);
        // Brute force: footprint as 20,000 boundary and interior sample points, nearest pair (textbook).
        let brute = Number.POSITIVE_INFINITY;
        for (let k = 0; k < points.length; k += 2) {
          const [px, py] = [points[k], points[k + 1]];
          const inside =
            footprint.shape === 'circle'
              ? Math.hypot(px, py) <= footprint.radius
              : Math.abs(px) <= footprint.length / 2 && Math.abs(py) <= footprint.width / 2;
          if (inside) brute = 0;
          for (let a = 0; a < 20000; a++) {
            const u = a / 20000;
            let bx: number;
            let by: number;
            if (footprint.shape === 'circle') {
              bx = footprint.radius * Math.cos(2 * Math.PI * u);
              by = footprint.radius * Math.sin(2 * Math.PI * u);
            } else {
              const perimeter = 2 * (footprint.length + footprint.width);
              const along = u * perimeter;
              const hl = footprint.length / 2;
              const hw = footprint.width / 2;
              const afterFirst = along - footprint.length;
              const afterSecond = afterFirst - footprint.width;
              if (along < footprint.length) [bx, by] = [-hl + along, -hw];
              else if (afterFirst < footprint.width) [bx, by] = [hl, -hw + afterFirst];
              else if (afterSecond < footprint.length) [bx, by] = [hl - afterSecond, hw];
              else [bx, by] = [-hl, hw - (afterSecond - footprint.length)];
            }
            brute = Math.min(brute, Math.hypot(px - bx, py - by));
          }
        }
        expect(Math.abs((footprintToPoints(footprint, points) as number) - brute)).toBeLessThan(0.001);
      }
    });
  }

  it('measures free travel to a point dead ahead: edge-to-point distance along the heading', () => {
    // A point 2 m ahead on the centre line: a 0.35 m circle touches it after 1.65 m, a 0.9 m long box after 1.55 m.
    expect(travelToPoints(FOOTPRINTS[0], [2, 0], 1)).toBeCloseTo(1.65, 12);
    expect(travelToPoints(FOOTPRINTS[1], [2, 0], 1)).toBeCloseTo(1.55, 12);
    // Astern it is not in the path; beside the swept corridor neither.
    expect(travelToPoints(FOOTPRINTS[0], [2, 0], -1)).toBeNull();
    expect(travelToPoints(FOOTPRINTS[0], [2, 0.4], 1)).toBeNull();
    // Off-centre by 0.21 m: the circle's edge meets it after 2 - sqrt(0.35^2 - 0.21^2) = 2 - 0.28 = 1.72 m.
    expect(travelToPoints(FOOTPRINTS[0], [2, 0.21], 1)).toBeCloseTo(1.72, 12);
  });
});

describe('contact probability under the belief', () => {
  const grid: OccupancyGrid = {
    resolution: 0.05,
    width: 200,
    height: 200,
    origin: [0, 0],
    cells: new Uint8Array(200 * 200),
  };
  // A 2 m x 2 m block in the middle of a 10 m x 10 m map (rows 90-129 from the north, columns 80-119).
  for (let i = 80; i < 120; i++) for (let j = 80; j < 120; j++) grid.cells[i * 200 + j] = CELL_OCCUPIED;
  const field = buildObstacleField(grid);

  function belief(centreX: number, centreY: number, spread: number) {
    const state = createParticleState(500);
    state.count = 500;
    const random = mulberry32(5);
    for (let p = 0; p < 500; p++) {
      state.x[p] = centreX + (random() * 2 - 1) * spread;
      state.y[p] = centreY + (random() * 2 - 1) * spread;
      state.theta[p] = (random() * 2 - 1) * Math.PI;
      state.logWeight[p] = -Math.log(500);
    }
    return state;
  }

  for (const footprint of FOOTPRINTS) {
    it(`is 1 for a belief entirely inside an obstacle and 0 far from one (${footprint.shape})`, () => {
      expect(gridContactShare(field, footprint, belief(5, 5, 0.3))).toBeCloseTo(1, 12);
      expect(gridContactShare(field, footprint, belief(1.5, 1.5, 0.3))).toBe(0);
    });
  }

  it('is the weight share: half the particles on the block, half far away, gives 0.5', () => {
    const state = belief(5, 5, 0.2);
    for (let p = 0; p < 250; p++) state.x[p] = 1.5;
    expect(gridContactShare(field, FOOTPRINTS[0], state)).toBeCloseTo(0.5, 9);
  });
});
