/**
 * A counterfactual replay is an ordinary replay of an edited copy of the bundle: cut to a window
 * of log time, with some scan returns removed or some map cells marked occupied. Everything is
 * in `CounterfactualSettings`, so the archive (or anyone) can re-run it from the original bundle.
 */
import { type Bundle, CELL_OCCUPIED, type ScanTable } from '../../bundle/types';
import { replayBundle } from '../index';
import type { CounterfactualSettings } from './cause-types';

/** Indices [first, last) of the sorted times `t` inside [start, end]. */
function rowsWithin(t: Float64Array, start: number, end: number): [number, number] {
  let first = 0;
  while (first < t.length && t[first] < start) first++;
  let last = first;
  while (last < t.length && t[last] <= end) last++;
  return [first, last];
}

/** Rows [first, last) of every column (typed array or array, nested objects too) of a table. */
function sliceColumns<T>(table: T, first: number, last: number): T {
  const out: Record<string, unknown> = {};
  for (const [name, column] of Object.entries(table as Record<string, unknown>)) {
    if (ArrayBuffer.isView(column)) out[name] = (column as Float64Array).slice(first, last);
    else if (Array.isArray(column)) out[name] = column.slice(first, last);
    else if (column && typeof column === 'object') out[name] = sliceColumns(column, first, last);
    else out[name] = column;
  }
  return out as T;
}

function sliceTable<T extends { t: Float64Array }>(
  table: T | undefined,
  start: number,
  end: number,
): T | undefined {
  if (!table) return table;
  const [first, last] = rowsWithin(table.t, start, end);
  return sliceColumns(table, first, last);
}

function sliceScans(scans: ScanTable | undefined, settings: CounterfactualSettings): ScanTable | undefined {
  if (!scans) return scans;
  const [first, last] = rowsWithin(scans.t, settings.span.start, settings.span.end);
  const ranges = scans.ranges.slice(first * scans.beams, last * scans.beams);
  const mask = settings.mask;
  if (mask) {
    const below = settings.masked_below ?? 0;
    const beams = settings.masked_beams ?? [];
    for (let row = first; row < last; row++) {
      if (scans.t[row] < mask.start || scans.t[row] > mask.end) continue;
      const base = (row - first) * scans.beams;
      for (const beam of beams) ranges[base + beam] = Number.NaN;
      if (below > 0)
        for (let b = 0; b < scans.beams; b++) if (ranges[base + b] < below) ranges[base + b] = Number.NaN;
    }
  }
  return { t: scans.t.slice(first, last), count: last - first, beams: scans.beams, ranges };
}

/** Odometry with every increment's travel scaled by `factor` from the first row (headings kept). */
function scaleOdometry(odometry: Bundle['odometry'], factor: number): Bundle['odometry'] {
  const x = odometry.x.slice();
  const y = odometry.y.slice();
  for (let k = 1; k < x.length; k++) {
    x[k] = x[k - 1] + factor * (odometry.x[k] - odometry.x[k - 1]);
    y[k] = y[k - 1] + factor * (odometry.y[k] - odometry.y[k - 1]);
  }
  return { ...odometry, x, y };
}

/** The edited bundle a counterfactual replays (see the file comment). */
export function buildCounterfactualBundle(bundle: Bundle, settings: CounterfactualSettings): Bundle {
  const { start, end } = settings.span;
  let map = bundle.map;
  if (settings.occupied_cells && settings.occupied_cells.length > 0 && map.grid) {
    const cells = map.grid.cells.slice();
    for (const cell of settings.occupied_cells)
      if (cell >= 0 && cell < cells.length) cells[cell] = CELL_OCCUPIED;
    map = { ...map, grid: { ...map.grid, cells } };
  }
  return {
    ...bundle,
    map,
    odometry:
      settings.odometry_scale === undefined
        ? sliceTable(bundle.odometry, start, end)!
        : scaleOdometry(sliceTable(bundle.odometry, start, end)!, settings.odometry_scale),
    scans: sliceScans(bundle.scans, settings),
    detections: sliceTable(bundle.detections, start, end),
    onboard: sliceTable(bundle.onboard, start, end),
    events: sliceTable(bundle.events, start, end),
    commands: sliceTable(bundle.commands, start, end),
    reference: sliceTable(bundle.reference, start, end),
  };
}

/** Replays a counterfactual: the edited bundle under exactly `settings.replay` (keyframes off). */
export function replayCounterfactual(bundle: Bundle, settings: CounterfactualSettings) {
  return replayBundle(
    buildCounterfactualBundle(bundle, settings),
    {},
    {
      settings: settings.replay,
      keyframeInterval: 0,
    },
  );
}
