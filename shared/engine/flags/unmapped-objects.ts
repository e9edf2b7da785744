/**
 * One unmapped object, one finding: the intervals marked by the free-space rule are re-projected
 * into world cells. Endpoints that stay on the same cells for at least OBJECT_PERSIST_SECONDS
 * belong to something static; intervals whose static cells touch are sightings of the same object
 * and give one `map_out_of_date` flag with all of them, its size and its place. An interval whose
 * endpoints do not stay put is a person or vehicle passing: `moving_obstacle`, context only.
 */
import type { ReplayContext } from '../replay-context';
import type { ReplaySeries } from '../replay-series';
import { scanEndpointsAt } from '../scan-endpoints';
import { classifyEndpoint } from './endpoint-class';
import type { FlagSighting, ReplayFlag } from './flag-types';
import { fixed, runSeconds } from './intervals';
import { type FreeSpaceRun, MAP_CRITICAL_DURATION, MAP_CRITICAL_SHARE, MAP_WINDOW } from './map-out-of-date';

/** World cell size (m) for telling static from moving endpoints (about half a person's width). */
export const OBJECT_CELL = 0.25;
/** A cell hit over at least this span of log time (s) holds something static. */
export const OBJECT_PERSIST_SECONDS = 1;
/** An interval is a static sighting when at least this share of its free endpoints sit on static cells. */
export const OBJECT_STATIC_SHARE = 0.5;
/** Objects at least this big across (m) read as a change to the site's structure (a rack, a wall), not a person or a pallet. */
export const OBJECT_STRUCTURE_SIZE = 1.0;

interface CellHits {
  ix: number;
  iy: number;
  firstT: number;
  lastT: number;
  count: number;
  minX: number;
  maxX: number;
  minY: number;
  maxY: number;
  sumX: number;
  sumY: number;
}

interface Sighting {
  run: FreeSpaceRun;
  /** Static cells by key. */
  cells: Map<number, CellHits>;
  staticShare: number;
}

/** Offset and stride of cell keys: maps are far smaller than 2^20 cells of 0.25 m a side. */
const KEY_OFFSET = 524_288;
const KEY_STRIDE = 1_048_576;

/** A key for cell (ix, iy). */
function cellKey(ix: number, iy: number): number {
  return (ix + KEY_OFFSET) * KEY_STRIDE + (iy + KEY_OFFSET);
}

/** The free endpoints of a run's usable steps, binned into world cells. */
function binRun(
  context: ReplayContext,
  series: ReplaySeries,
  usable: Uint8Array,
  run: FreeSpaceRun,
): Sighting {
  const cells = new Map<number, CellHits>();
  let free = 0;
  for (let k = run.first; k <= run.last; k++) {
    if (!usable[k]) continue;
    const endpoints = scanEndpointsAt(context, series, k);
    for (let e = 0; e < endpoints.length; e += 2) {
      const x = endpoints[e];
      const y = endpoints[e + 1];
      if (classifyEndpoint(context, x, y) !== 2) continue;
      free++;
      const ix = Math.floor(x / OBJECT_CELL);
      const iy = Math.floor(y / OBJECT_CELL);
      const key = cellKey(ix, iy);
      let cell = cells.get(key);
      if (!cell) {
        cell = {
          ix,
          iy,
          firstT: series.t[k],
          lastT: series.t[k],
          count: 0,
          minX: x,
          maxX: x,
          minY: y,
          maxY: y,
          sumX: 0,
          sumY: 0,
        };
        cells.set(key, cell);
      }
      cell.lastT = series.t[k];
      cell.count++;
      cell.minX = Math.min(cell.minX, x);
      cell.maxX = Math.max(cell.maxX, x);
      cell.minY = Math.min(cell.minY, y);
      cell.maxY = Math.max(cell.maxY, y);
      cell.sumX += x;
      cell.sumY += y;
    }
  }
  const staticCells = new Map<number, CellHits>();
  let onStatic = 0;
  for (const [key, cell] of cells)
    if (cell.lastT - cell.firstT >= OBJECT_PERSIST_SECONDS - 1e-9) {
      staticCells.set(key, cell);
      onStatic += cell.count;
    }
  return { run, cells: largestPatch(staticCells), staticShare: free > 0 ? onStatic / free : 0 };
}

/**
 * The connected patch (8-neighbour) of static cells holding the most endpoints: the object the
 * interval is about, without stray static returns elsewhere in view stretching its size.
 */
function largestPatch(cells: Map<number, CellHits>): Map<number, CellHits> {
  const seen = new Set<number>();
  let best = new Map<number, CellHits>();
  let bestCount = -1;
  for (const [start, startCell] of cells) {
    if (seen.has(start)) continue;
    const patch = new Map<number, CellHits>([[start, startCell]]);
    const queue = [startCell];
    seen.add(start);
    let count = 0;
    while (queue.length > 0) {
      const cell = queue.pop() as CellHits;
      count += cell.count;
      for (let dx = -1; dx <= 1; dx++)
        for (let dy = -1; dy <= 1; dy++) {
          const key = cellKey(cell.ix + dx, cell.iy + dy);
          const next = cells.get(key);
          if (!next || seen.has(key)) continue;
          seen.add(key);
          patch.set(key, next);
          queue.push(next);
        }
    }
    if (count > bestCount) {
      best = patch;
      bestCount = count;
    }
  }
  return best;
}

/** True when a static cell of `a` is the same as or next to one of `b`. */
function touches(a: Sighting, b: Sighting): boolean {
  for (const cell of a.cells.values())
    for (let dx = -1; dx <= 1; dx++)
      for (let dy = -1; dy <= 1; dy++) if (b.cells.has(cellKey(cell.ix + dx, cell.iy + dy))) return true;
  return false;
}

/** Groups static sightings whose cells touch (union-find, deterministic order). */
function groupSightings(sightings: Sighting[]): Sighting[][] {
  const parent = sightings.map((_, i) => i);
  const root = (i: number): number => {
    while (parent[i] !== i) i = parent[i] = parent[parent[i]];
    return i;
  };
  for (let i = 0; i < sightings.length; i++)
    for (let j = i + 1; j < sightings.length; j++)
      if (root(i) !== root(j) && touches(sightings[i], sightings[j])) parent[root(j)] = root(i);
  const groups = new Map<number, Sighting[]>();
  sightings.forEach((sighting, i) => {
    const r = root(i);
    groups.set(r, [...(groups.get(r) ?? []), sighting]);
  });
  return [...groups.values()];
}

function describeObject(series: ReplaySeries, group: Sighting[]): ReplayFlag {
  let minX = Number.POSITIVE_INFINITY;
  let maxX = Number.NEGATIVE_INFINITY;
  let minY = Number.POSITIVE_INFINITY;
  let maxY = Number.NEGATIVE_INFINITY;
  let sumX = 0;
  let sumY = 0;
  let count = 0;
  let seconds = 0;
  let free = 0;
  let total = 0;
  let peak = 0;
  let isStrong = false;
  const merged = new Map<number, CellHits>();
  for (const sighting of group) {
    for (const [key, cell] of sighting.cells) merged.set(key, cell);
    seconds += runSeconds(series.t, sighting.run);
    free += sighting.run.free;
    total += sighting.run.total;
    peak = Math.max(peak, sighting.run.peak);
    isStrong ||= sighting.run.isStrong;
  }
  for (const cell of merged.values()) {
    minX = Math.min(minX, cell.minX);
    maxX = Math.max(maxX, cell.maxX);
    minY = Math.min(minY, cell.minY);
    maxY = Math.max(maxY, cell.maxY);
    sumX += cell.sumX;
    sumY += cell.sumY;
    count += cell.count;
  }
  const size = Math.max(maxX - minX, maxY - minY, OBJECT_CELL);
  const x = sumX / count;
  const y = sumY / count;
  const isStructure = size >= OBJECT_STRUCTURE_SIZE;
  const passes = group.length;
  const reading = isStructure
    ? 'Structure-sized: the site itself likely differs from the map (a moved rack, a new wall or stack).'
    : 'Person- or pallet-sized: likely something standing there rather than a change to the site.';
  const sightings: FlagSighting[] = group.map((s) => ({
    start: series.t[s.run.first],
    end: series.t[s.run.last],
  }));
  return {
    kind: 'map_out_of_date',
    start: sightings[0].start,
    end: sightings[sightings.length - 1].end,
    // Critical needs both: a structure-sized object and one sighting that held a large share for long.
    severity: isStructure && isStrong ? 'critical' : 'warning',
    evidence:
      `Unmapped object about ${fixed(size)} m across at (${fixed(x)}, ${fixed(y)}) m, seen on ${passes} ${passes === 1 ? 'pass' : 'passes'}, ` +
      `${fixed(seconds)} s in view: ${fixed((100 * free) / Math.max(1, total), 0)} % of scan endpoints ` +
      `(peak ${fixed(peak * 100, 0)} % per ${MAP_WINDOW} s) landed where the map has free floor. ${reading}` +
      (isStrong && !isStructure
        ? ` One sighting held at least ${fixed(MAP_CRITICAL_SHARE * 100, 0)} % for ${MAP_CRITICAL_DURATION} s, but an object this small is not taken for a map change.`
        : ''),
    sightings,
    location: { x, y },
    size,
  };
}

function describeMover(series: ReplaySeries, sighting: Sighting): ReplayFlag {
  const { run } = sighting;
  const x = run.free > 0 ? run.sumX / run.free : Number.NaN;
  const y = run.free > 0 ? run.sumY / run.free : Number.NaN;
  return {
    kind: 'moving_obstacle',
    start: series.t[run.first],
    end: series.t[run.last],
    severity: 'info',
    evidence:
      `For ${fixed(runSeconds(series.t, run))} s ${fixed((100 * run.free) / Math.max(1, run.total), 0)} % of scan endpoints ` +
      `landed on free floor around (${fixed(x)}, ${fixed(y)}) m, but only ${fixed(sighting.staticShare * 100, 0)} % stayed on the same ` +
      `${OBJECT_CELL} m cells for ${OBJECT_PERSIST_SECONDS} s: something moving past (a person or a vehicle), not a change to the map.`,
  };
}

/** Turns free-space intervals into one flag per unmapped object plus context flags for movers. */
export function describeUnmappedObjects(
  context: ReplayContext,
  series: ReplaySeries,
  usable: Uint8Array,
  runs: FreeSpaceRun[],
): ReplayFlag[] {
  const binned = runs.map((run) => binRun(context, series, usable, run));
  const still = binned.filter((s) => s.staticShare >= OBJECT_STATIC_SHARE && s.cells.size > 0);
  const movers = binned.filter((s) => !(s.staticShare >= OBJECT_STATIC_SHARE && s.cells.size > 0));
  return [
    ...groupSightings(still).map((group) => describeObject(series, group)),
    ...movers.map((s) => describeMover(series, s)),
  ];
}
