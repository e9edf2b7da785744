import { createGrid, fillBox, type SimGrid } from './sim-grid';

/** A landmark of the invented site, map frame (m). */
export interface SiteLandmark {
  id: string;
  class: 'reflector' | 'dock' | 'column';
  x: number;
  y: number;
}

export interface SiteWorld {
  grid: SimGrid;
  landmarks: SiteLandmark[];
}

export const SITE_NAME = 'Harbourline Cold Store, Dock Hall B';
export const SITE_WIDTH_M = 30;
export const SITE_HEIGHT_M = 20;
export const SITE_RESOLUTION_M = 0.05;

/** Rack rows run east–west: a west block and an east block on either side of a 2 m cross aisle. */
const RACK_BANDS: ReadonlyArray<[number, number]> = [
  [3.8, 5.0],
  [7.6, 8.8],
  [11.4, 12.6],
  [15.2, 16.4],
];
const RACK_WEST_BLOCK: [number, number] = [8.0, 16.0];
const RACK_EAST_BLOCK: [number, number] = [18.0, 27.0];
const COLUMN_HALF_SIZE = 0.2;
const COLUMN_CENTRES: ReadonlyArray<[string, number, number]> = [
  ['C-01', 1.2, 5.6],
  ['C-02', 1.2, 11.0],
  ['C-03', 1.2, 16.4],
  ['C-04', 29.2, 4.4],
  ['C-05', 29.2, 12.0],
  ['C-06', 6.0, 18.6],
  ['C-07', 24.0, 3.0],
];
/** Dock-door bumpers along the south wall, and the charging dock in the south-west corner. */
const DOCK_BUMPERS: ReadonlyArray<[string, number]> = [
  ['DK-2', 11.0],
  ['DK-3', 15.0],
  ['DK-4', 19.0],
];
const CHARGER_X = 2.0;

/**
 * How the true world differs from the map the robot carries. `rackRowShiftX` moves the east block
 * of one rack row (index into the four rows, south first) by that many metres along x.
 */
export interface WorldChanges {
  movedRack?: { row: number; shiftX: number };
}

/**
 * Builds the invented site: 30 m x 20 m at 0.05 m per cell, outer walls, four rack rows split by a
 * cross aisle, square columns, dock-door bumpers and a charging dock, plus the landmarks a
 * detector can see (reflector strips on rack ends, dock targets, columns).
 */
export function buildSite(changes: WorldChanges = {}): SiteWorld {
  const grid = createGrid(SITE_WIDTH_M, SITE_HEIGHT_M, SITE_RESOLUTION_M);
  const landmarks: SiteLandmark[] = [];
  const wall = 0.2;
  fillBox(grid, 0, 0, SITE_WIDTH_M, wall);
  fillBox(grid, 0, SITE_HEIGHT_M - wall, SITE_WIDTH_M, SITE_HEIGHT_M);
  fillBox(grid, 0, 0, wall, SITE_HEIGHT_M);
  fillBox(grid, SITE_WIDTH_M - wall, 0, SITE_WIDTH_M, SITE_HEIGHT_M);

  RACK_BANDS.forEach(([south, north], row) => {
    const middle = (south + north) / 2;
    const rowLetter = String.fromCharCode(65 + row);
    fillBox(grid, RACK_WEST_BLOCK[0], south, RACK_WEST_BLOCK[1], north);
    const shift = changes.movedRack?.row === row ? changes.movedRack.shiftX : 0;
    const eastStart = RACK_EAST_BLOCK[0] + shift;
    const eastEnd = RACK_EAST_BLOCK[1] + shift;
    fillBox(grid, eastStart, south, eastEnd, north);
    landmarks.push(
      { id: `R-${rowLetter}1`, class: 'reflector', x: RACK_WEST_BLOCK[0], y: middle },
      { id: `R-${rowLetter}2`, class: 'reflector', x: RACK_WEST_BLOCK[1], y: middle },
      { id: `R-${rowLetter}3`, class: 'reflector', x: eastStart, y: middle },
      { id: `R-${rowLetter}4`, class: 'reflector', x: eastEnd, y: middle },
    );
  });

  for (const [id, x, y] of COLUMN_CENTRES) {
    fillBox(grid, x - COLUMN_HALF_SIZE, y - COLUMN_HALF_SIZE, x + COLUMN_HALF_SIZE, y + COLUMN_HALF_SIZE);
    landmarks.push({ id, class: 'column', x, y });
  }

  fillBox(grid, CHARGER_X - 0.3, wall, CHARGER_X + 0.3, wall + 0.3);
  landmarks.push({ id: 'DK-1', class: 'dock', x: CHARGER_X, y: wall + 0.3 });
  for (const [id, x] of DOCK_BUMPERS) {
    fillBox(grid, x - 0.4, wall, x + 0.4, wall + 0.25);
    landmarks.push({ id, class: 'dock', x, y: wall + 0.25 });
  }
  return { grid, landmarks };
}
