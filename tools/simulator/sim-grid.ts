/**
 * The simulator's occupancy grid. Unlike map.json (row 0 = northmost), rows here count from the
 * south (`occupied[iy * width + ix]`, iy = 0 southmost) so that cell indices grow with x and y;
 * `toMapRows` does the flip when the map is written.
 */
export interface SimGrid {
  /** m per cell */
  resolution: number;
  width: number;
  height: number;
  /** Map-frame position of the south-west corner, m. */
  originX: number;
  originY: number;
  /** 1 = occupied, 0 = free. */
  occupied: Uint8Array;
}

export function createGrid(widthM: number, heightM: number, resolution: number): SimGrid {
  const width = Math.round(widthM / resolution);
  const height = Math.round(heightM / resolution);
  return { resolution, width, height, originX: 0, originY: 0, occupied: new Uint8Array(width * height) };
}

export function cloneGrid(grid: SimGrid): SimGrid {
  return { ...grid, occupied: grid.occupied.slice() };
}

/** Marks (or clears) every cell whose centre lies inside the axis-aligned box, in metres. */
export function fillBox(
  grid: SimGrid,
  x0: number,
  y0: number,
  x1: number,
  y1: number,
  value: 0 | 1 = 1,
): void {
  const res = grid.resolution;
  const ixStart = Math.max(0, Math.ceil((x0 - grid.originX) / res - 0.5));
  const ixEnd = Math.min(grid.width - 1, Math.floor((x1 - grid.originX) / res - 0.5));
  const iyStart = Math.max(0, Math.ceil((y0 - grid.originY) / res - 0.5));
  const iyEnd = Math.min(grid.height - 1, Math.floor((y1 - grid.originY) / res - 0.5));
  for (let iy = iyStart; iy <= iyEnd; iy++) {
    grid.occupied.fill(value, iy * grid.width + ixStart, iy * grid.width + ixEnd + 1);
  }
}

/** True when the point (m) falls in an occupied cell or outside the grid. */
export function isOccupiedAt(grid: SimGrid, x: number, y: number): boolean {
  const ix = Math.floor((x - grid.originX) / grid.resolution);
  const iy = Math.floor((y - grid.originY) / grid.resolution);
  if (ix < 0 || iy < 0 || ix >= grid.width || iy >= grid.height) return true;
  return grid.occupied[iy * grid.width + ix] === 1;
}

/**
 * Distance (m) from a point to the nearest occupied cell's square, searched within `searchRadius`;
 * returns `searchRadius` when nothing is that close.
 */
export function clearanceAt(grid: SimGrid, x: number, y: number, searchRadius: number): number {
  const res = grid.resolution;
  const cx = (x - grid.originX) / res;
  const cy = (y - grid.originY) / res;
  const reach = Math.ceil(searchRadius / res) + 1;
  let best = searchRadius;
  const iyStart = Math.max(0, Math.floor(cy) - reach);
  const iyEnd = Math.min(grid.height - 1, Math.floor(cy) + reach);
  const ixStart = Math.max(0, Math.floor(cx) - reach);
  const ixEnd = Math.min(grid.width - 1, Math.floor(cx) + reach);
  for (let iy = iyStart; iy <= iyEnd; iy++) {
    const row = iy * grid.width;
    const gapY = Math.max(iy - cy, 0, cy - (iy + 1)) * res;
    if (gapY >= best) continue;
    for (let ix = ixStart; ix <= ixEnd; ix++) {
      if (grid.occupied[row + ix] !== 1) continue;
      const gapX = Math.max(ix - cx, 0, cx - (ix + 1)) * res;
      const distance = Math.hypot(gapX, gapY);
      if (distance < best) best = distance;
    }
  }
  return best;
}

/** map.json `rows`: northmost row first, `#` occupied, `.` free. */
export function toMapRows(grid: SimGrid): string[] {
  const rows: string[] = [];
  for (let iy = grid.height - 1; iy >= 0; iy--) {
    let row = '';
    for (let ix = 0; ix < grid.width; ix++) row += grid.occupied[iy * grid.width + ix] === 1 ? '#' : '.';
    rows.push(row);
  }
  return rows;
}
