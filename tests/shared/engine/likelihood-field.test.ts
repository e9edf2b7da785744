import jStat from 'jstat';
import { describe, expect, it } from 'vitest';
import type { OccupancyGrid, ScanConfig } from '../../../shared/bundle/types';
import {
  accumulateScanLogLikelihood,
  buildBeamGeometry,
  buildLikelihoodField,
  robotFrameEndpoints,
  selectEvenlySpacedBeams,
} from '../../../shared/engine/likelihood-field';

const MODEL = { model: 'likelihood_field' as const, z_hit: 0.9, z_rand: 0.1, sigma_hit: 0.1, beams_used: 3 };
const RANGE_MAX = 10;

/** 20 x 10 grid at 0.1 m, one occupied cell at row 2 (from the north), column 5; unknown cell at (0, 19). */
function smallGrid(): OccupancyGrid {
  const cells = new Uint8Array(200);
  cells[2 * 20 + 5] = 1;
  cells[19] = 2;
  return { resolution: 0.1, width: 20, height: 10, origin: [1, 2], cells };
}

/** Likelihood-field value from Thrun, Burgard, Fox (2005), Table 6.3: z_hit N(d; 0, sigma) + z_rand / z_max. */
const tableValue = (d: number) => Math.log(0.9 * jStat.normal.pdf(d, 0, 0.1) + 0.1 / RANGE_MAX);

describe('likelihood field (Thrun, Burgard, Fox 2005, Table 6.3)', () => {
  const field = buildLikelihoodField(smallGrid(), MODEL, RANGE_MAX);
  // The occupied cell (map row 2 from the north, column 5) is south-up row 7; its centre (1.55, 2.75).
  const cellValue = (row: number, column: number) => field.logLikelihood[row * 20 + column];

  it('stores log(z_hit N(d) + z_rand/z_max) with d the distance to the nearest occupied cell', () => {
    expect(cellValue(7, 5)).toBeCloseTo(tableValue(0), 5);
    expect(cellValue(7, 8)).toBeCloseTo(tableValue(0.3), 5);
    expect(cellValue(3, 8)).toBeCloseTo(tableValue(0.5), 5);
    expect(field.distance[3 * 20 + 8]).toBeCloseTo(0.5, 6);
  });

  it('gives unknown cells and points outside the grid the z_rand / z_max floor', () => {
    expect(cellValue(9, 19)).toBeCloseTo(Math.log(0.1 / RANGE_MAX), 6);
    const out = new Float64Array(1);
    // A particle at the occupied cell centre facing east, one endpoint 50 m ahead.
    accumulateScanLogLikelihood(
      field,
      Float64Array.of(1.55),
      Float64Array.of(2.75),
      Float64Array.of(1),
      Float64Array.of(0),
      0,
      1,
      Float64Array.of(50),
      Float64Array.of(0),
      1,
      out,
    );
    expect(out[0]).toBeCloseTo(Math.log(0.1 / RANGE_MAX), 6);
  });

  it('sums the cell values at the endpoints transformed by the particle pose', () => {
    const out = new Float64Array(1);
    // Particle 0.3 m west of the occupied cell centre, heading +90°; a robot-frame endpoint (0, -0.3)
    // lands on the occupied cell, (0.2, 0) lands 0.2 m north of the particle: cell (south-up row 9,
    // column 2), 3 columns and 2 rows from the occupied cell (d = sqrt(13) * 0.1 m).
    const c = Math.cos(Math.PI / 2);
    accumulateScanLogLikelihood(
      field,
      Float64Array.of(1.25),
      Float64Array.of(2.75),
      Float64Array.of(c),
      Float64Array.of(1),
      0,
      1,
      Float64Array.of(0, 0.2),
      Float64Array.of(-0.3, 0),
      2,
      out,
    );
    expect(out[0]).toBeCloseTo(tableValue(0) + tableValue(Math.sqrt(13) * 0.1), 5);
  });
});

describe('beam selection', () => {
  it('spaces beams evenly and keeps both ends', () => {
    expect(Array.from(selectEvenlySpacedBeams(271, 5))).toEqual([0, 68, 135, 203, 270]);
    expect(Array.from(selectEvenlySpacedBeams(271, 1))).toEqual([135]);
    expect(selectEvenlySpacedBeams(10, 50).length).toBe(10);
  });

  it('skips null, max-range and below-minimum beams and applies the sensor mount', () => {
    const scan: ScanConfig = {
      mount: [0.2, 0.1, Math.PI / 2],
      angle_min: -0.5,
      angle_increment: 0.5,
      beams: 3,
      range_min: 0.1,
      range_max: 5,
    };
    const geometry = buildBeamGeometry(scan, 3);
    const endX = new Float64Array(3);
    const endY = new Float64Array(3);
    const ranges = Float32Array.of(1, 2, Number.NaN, 5, 0.05, 3);
    expect(robotFrameEndpoints(ranges, 0, scan, geometry, endX, endY)).toBe(2);
    // Beam 1 (angle 0 in the sensor frame) points along the robot's +y because the mount turns 90°.
    expect(endX[1]).toBeCloseTo(0.2, 6);
    expect(endY[1]).toBeCloseTo(0.1 + 2, 6);
    expect(robotFrameEndpoints(ranges, 1, scan, geometry, endX, endY)).toBe(1);
  });

  it('sums each particle over odd and even particle ranges exactly like a one-particle-at-a-time loop', () => {
    // The kernel handles particles in pairs; every range split must give the plain per-particle sum.
    const field = buildLikelihoodField(smallGrid(), MODEL, RANGE_MAX);
    const n = 7;
    const x = Float64Array.from({ length: n }, (_, i) => 1.2 + 0.11 * i);
    const y = Float64Array.from({ length: n }, (_, i) => 2.3 + 0.07 * i);
    const heading = Float64Array.from({ length: n }, (_, i) => -3 + 0.9 * i);
    const cos = heading.map(Math.cos);
    const sin = heading.map(Math.sin);
    const endX = Float64Array.of(0.3, -0.2, 0.5, 40);
    const endY = Float64Array.of(0.1, 0.4, -0.35, 0);
    const expected = new Float64Array(n);
    for (let i = 0; i < n; i++)
      accumulateScanLogLikelihood(field, x, y, cos, sin, i, i + 1, endX, endY, 4, expected);
    for (const [from, to] of [
      [0, 7],
      [0, 6],
      [1, 7],
      [2, 5],
      [3, 3],
    ]) {
      const out = new Float64Array(n);
      accumulateScanLogLikelihood(field, x, y, cos, sin, from, to, endX, endY, 4, out);
      for (let i = 0; i < n; i++) expect(out[i]).toBe(i >= from && i < to ? expected[i] : 0);
    }
    // Independent check of one particle against the table (Thrun, Burgard, Fox 2005, Table 6.3):
    // the endpoint 40 m ahead is off the grid and gets the floor.
    expect(expected[0]).toBeLessThan(0);
    expect(expected.some((v) => v > 4 * Math.log(0.1 / RANGE_MAX))).toBe(true);
  });

  it('looks up the cell under each transformed endpoint, inside the map and past its edges', () => {
    // Reference: transform each endpoint by the pose (x + c ex - s ey, y + s ex + c ey) and read
    // the cell containing it, floor value off the grid (Thrun, Burgard, Fox 2005, Table 6.3).
    const field = buildLikelihoodField(smallGrid(), MODEL, RANGE_MAX);
    const cellAt = (mx: number, my: number) => {
      const column = Math.floor((mx - 1) / 0.1);
      const row = Math.floor((my - 2) / 0.1);
      const isOnGrid = column >= 0 && column < 20 && row >= 0 && row < 10;
      return isOnGrid ? field.logLikelihood[row * 20 + column] : Math.log(0.1 / RANGE_MAX);
    };
    const endX = Float64Array.of(0.31, -0.17, 0.52, 0.05, -0.43);
    const endY = Float64Array.of(0.12, 0.41, -0.36, -0.07, -0.21);
    let state = 12345;
    const next = () => {
      state = (Math.imul(state, 1103515245) + 12345) >>> 0;
      return state / 4294967296;
    };
    const n = 400;
    // Positions from 1 m west of the grid to 1 m east of it (the grid spans x 1..3, y 2..3).
    const x = Float64Array.from({ length: n }, () => 0 + 4 * next());
    const y = Float64Array.from({ length: n }, () => 1 + 3 * next());
    const heading = Float64Array.from({ length: n }, () => Math.PI * (2 * next() - 1));
    const cos = heading.map(Math.cos);
    const sin = heading.map(Math.sin);
    const out = new Float64Array(n);
    accumulateScanLogLikelihood(field, x, y, cos, sin, 0, n, endX, endY, 5, out);
    for (let i = 0; i < n; i++) {
      let expected = 0;
      for (let k = 0; k < 5; k++)
        expected += cellAt(
          x[i] + cos[i] * endX[k] - sin[i] * endY[k],
          y[i] + sin[i] * endX[k] + cos[i] * endY[k],
        );
      expect(out[i]).toBeCloseTo(expected, 5);
    }
  });
});
