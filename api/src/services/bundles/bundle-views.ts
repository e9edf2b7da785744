import fs from 'node:fs';
import path from 'node:path';
import type { Bundle, Footprint, OccupancyGrid, PoseColumns } from '../../../../shared/bundle/types';
import { CELL_OCCUPIED } from '../../../../shared/bundle/types';
import type { TBundleMap, TBundleTracks, TReplayClearance } from '../../../../shared/contracts/bundle-views';
import { squaredDistanceTransform } from '../../../../shared/engine/distance-transform';
import { AppError } from '../../../../shared/errors';
import { loadBundleForReplay } from '../../replays/replay-bundle-file';
import { replayDir } from '../../replays/replay-files';

const CELL_CHAR = ['.', '#', '?'];

export interface BundleViewsOptions {
  /** Path of the stored original zip of a bundle (checked to exist by the caller). */
  originalPath: (bundleId: string) => Promise<string>;
  /** Whether the replay was run on this bundle (its clearance is measured on this bundle's map). */
  isReplayOf: (bundleId: string, replayId: string) => Promise<boolean>;
  derivedDir: string;
  maxUnpackedBytes: number;
}

/** Distance (m) from the footprint's edge to its centre that a clearance is measured from. */
export function footprintReach(footprint: Footprint): number {
  // A rectangle's half-width: the side that passes closest to aisle walls when driving straight.
  return footprint.shape === 'circle' ? footprint.radius : footprint.width / 2;
}

function gridRows(grid: OccupancyGrid): string[] {
  const rows: string[] = [];
  for (let i = 0; i < grid.height; i++) {
    let row = '';
    for (let j = 0; j < grid.width; j++) row += CELL_CHAR[grid.cells[i * grid.width + j]] ?? '?';
    rows.push(row);
  }
  return rows;
}

const round = (value: number, digits = 1000) => Math.round(value * digits) / digits;

function poseTrack(table: PoseColumns | undefined) {
  if (!table) return null;
  return {
    t: Array.from(table.t, (v) => round(v)),
    x: Array.from(table.x, (v) => round(v)),
    y: Array.from(table.y, (v) => round(v)),
    theta: Array.from(table.theta, (v) => round(v)),
  };
}

/** Speed (m/s) between consecutive odometry readings, stamped at the later reading. */
export function odometrySpeed(odometry: PoseColumns): { t: number[]; speed: number[] } {
  const t: number[] = [];
  const speed: number[] = [];
  for (let k = 1; k < odometry.t.length; k++) {
    const dt = odometry.t[k] - odometry.t[k - 1];
    if (!(dt > 0)) continue;
    const distance = Math.hypot(odometry.x[k] - odometry.x[k - 1], odometry.y[k] - odometry.y[k - 1]);
    t.push(round(odometry.t[k]));
    speed.push(round(distance / dt));
  }
  return { t, speed };
}

/**
 * Clearance (m) from the footprint's edge to the nearest occupied cell at each mean pose:
 * Euclidean distance transform of the occupied cells, minus the footprint reach. null when the
 * pose is off the grid or undefined.
 */
export function clearanceAlong(
  grid: OccupancyGrid,
  reach: number,
  x: ArrayLike<number | null>,
  y: ArrayLike<number | null>,
): (number | null)[] {
  const occupied = new Uint8Array(grid.cells.length);
  for (let c = 0; c < occupied.length; c++) occupied[c] = grid.cells[c] === CELL_OCCUPIED ? 1 : 0;
  const squared = squaredDistanceTransform(occupied, grid.width, grid.height);
  const out: (number | null)[] = new Array(x.length);
  for (let k = 0; k < x.length; k++) {
    const px = x[k];
    const py = y[k];
    if (px === null || py === null || !Number.isFinite(px) || !Number.isFinite(py)) {
      out[k] = null;
      continue;
    }
    const j = Math.floor((px - grid.origin[0]) / grid.resolution);
    const i = grid.height - 1 - Math.floor((py - grid.origin[1]) / grid.resolution);
    if (i < 0 || j < 0 || i >= grid.height || j >= grid.width) {
      out[k] = null;
      continue;
    }
    out[k] = round(Math.sqrt(squared[i * grid.width + j]) * grid.resolution - reach);
  }
  return out;
}

/** Read-only views of a stored bundle for the workspace: map, tracks, clearance along a replay. */
export function createBundleViews({
  originalPath,
  isReplayOf,
  derivedDir,
  maxUnpackedBytes,
}: BundleViewsOptions) {
  // Parsing a bundle takes a while; the last few stay in memory while an investigator scrubs.
  // The replay service reads parsed bundles through this same cache, so each is parsed once.
  const cache = new Map<string, Promise<Bundle>>();
  function parsedBundle(bundleId: string): Promise<Bundle> {
    const hit = cache.get(bundleId);
    if (hit) return hit;
    const pending = originalPath(bundleId).then((file) => loadBundleForReplay(file, maxUnpackedBytes));
    pending.catch(() => cache.delete(bundleId));
    cache.set(bundleId, pending);
    while (cache.size > 3) cache.delete(cache.keys().next().value as string);
    return pending.catch((error: unknown) => {
      throw new AppError('invalid_bundle', `Bundle ${bundleId} cannot be read: ${(error as Error).message}`);
    });
  }

  async function bundleMap(bundleId: string): Promise<TBundleMap> {
    const { map, manifest } = await parsedBundle(bundleId);
    return {
      resolution: map.resolution,
      origin: map.origin,
      width: map.width,
      height: map.height,
      rows: map.grid ? gridRows(map.grid) : null,
      landmarks: map.landmarks,
      footprint: manifest.robot.footprint,
      scanMount: manifest.scan?.mount ?? null,
    };
  }

  async function bundleTracks(bundleId: string): Promise<TBundleTracks> {
    const bundle = await parsedBundle(bundleId);
    return {
      startTime: bundle.manifest.start_time,
      events: bundle.events
        ? Array.from(bundle.events.t, (t, k) => ({
            t,
            kind: bundle.events!.kind[k],
            detail: bundle.events!.detail[k],
          }))
        : [],
      onboard: poseTrack(bundle.onboard),
      reference: poseTrack(bundle.reference),
      speed: odometrySpeed(bundle.odometry),
      commands: bundle.commands
        ? {
            t: Array.from(bundle.commands.t, (v) => round(v)),
            v: Array.from(bundle.commands.v, (v) => round(v)),
          }
        : null,
      filter: bundle.manifest.filter,
      scanBeams: bundle.manifest.scan?.beams ?? null,
    };
  }

  async function replayClearance(bundleId: string, replayId: string): Promise<TReplayClearance> {
    if (!(await isReplayOf(bundleId, replayId))) {
      throw new AppError('not_found', `Bundle ${bundleId} has no replay ${replayId}.`);
    }
    const file = path.join(replayDir(derivedDir, replayId), 'series.json');
    const raw = await fs.promises.readFile(file, 'utf8').catch(() => {
      throw new AppError('not_found', `Replay ${replayId} of bundle ${bundleId} has no finished series.`);
    });
    const columns = JSON.parse(raw) as Record<string, (number | null)[]>;
    const { map, manifest } = await parsedBundle(bundleId);
    const reach = footprintReach(manifest.robot.footprint);
    return {
      footprintReach: reach,
      clearance: map.grid ? clearanceAlong(map.grid, reach, columns.x, columns.y) : columns.x.map(() => null),
    };
  }

  return { bundleMap, bundleTracks, replayClearance, parsedBundle };
}
