/**
 * map_changed and moving_obstacles: both start from the flags that sort free-floor endpoints in
 * world coordinates (flags/unmapped-objects.ts). A static object keeps its endpoints on the same
 * world cells across poses; marking those cells occupied in a counterfactual map must let the
 * scans fit again. Endpoints that move from scan to scan are people or vehicles: reported, not a
 * fault, and there is no map edit that would explain them.
 */

import { classifyEndpoint } from '../flags/endpoint-class';
import { fixed } from '../flags/intervals';
import { OBJECT_STRUCTURE_SIZE } from '../flags/unmapped-objects';
import { hypot } from '../numerics';
import { scanEndpointsAt } from '../scan-endpoints';
import { SHORT_RANGE } from './beam-persistence';
import type { ScoredCause } from './cause-score';
import type { CauseFlag, CauseInput, CounterfactualRun } from './cause-types';
import {
  compareEvidence,
  type RunCounterfactual,
  stepAt,
  windowAround,
  windowSettings,
} from './counterfactual-runner';
import { endpointMapCell } from './endpoint-cells';

/** A map cell is marked occupied when at least this many free-floor endpoints of the object hit it. */
export const MAP_CELL_MIN_HITS = 3;
/** Endpoints further than this (m) beyond the object's half size from its centre are not its own. */
const OBJECT_MARGIN = 0.3;
/** Evidence gain (nats per measurement) with the cells occupied that supports a changed map. */
export const MAP_MIN_GAIN = 0.1;
/** An "object" with at least this share of its endpoints within SHORT_RANGE of the robot is taken for the sensor's own window. */
export const MAP_MAX_NEAR_SHARE = 0.9;
/** Seconds in view that count as full evidence of a static object. */
const FULL_VIEW_SECONDS = 3;
/** Strength given to a passing mover: reported for context, never the answer on its own. */
const MOVER_STRENGTH = 0.5;

/**
 * Map cells under the object's free-floor endpoints during its first sighting, hit often enough,
 * and the share of those endpoints closer than SHORT_RANGE to the robot.
 */
function objectCells(
  input: CauseInput,
  flag: CauseFlag,
  start: number,
  end: number,
): { cells: number[]; nearShare: number } {
  const { context, series } = input;
  const location = flag.location!;
  const reach = (flag.size ?? 0) / 2 + OBJECT_MARGIN;
  const hits = new Map<number, number>();
  let near = 0;
  let counted = 0;
  for (let k = stepAt(series, start); k < series.t.length && series.t[k] <= end; k++) {
    const endpoints = scanEndpointsAt(context, series, k);
    for (let e = 0; e < endpoints.length; e += 2) {
      const x = endpoints[e];
      const y = endpoints[e + 1];
      if (Math.abs(x - location.x) > reach || Math.abs(y - location.y) > reach) continue;
      if (classifyEndpoint(context, x, y) !== 2) continue;
      const cell = endpointMapCell(context, x, y);
      if (cell < 0) continue;
      hits.set(cell, (hits.get(cell) ?? 0) + 1);
      if (hypot(x - series.x[k], y - series.y[k]) < SHORT_RANGE) near++;
      counted++;
    }
  }
  const cells = [...hits.entries()]
    .filter(([, count]) => count >= MAP_CELL_MIN_HITS)
    .map(([cell]) => cell)
    .sort((a, b) => a - b);
  return { cells, nearShare: counted > 0 ? near / counted : 0 };
}

function mapChanged(input: CauseInput, run: RunCounterfactual, flag: CauseFlag): ScoredCause {
  const first = flag.sightings?.[0] ?? { start: flag.start, end: flag.end };
  const { cells, nearShare } = objectCells(input, flag, first.start, first.end);
  // Endpoints that keep hugging the robot as it moves are on the sensor's window, not in the site.
  const isOnSensor = nearShare >= MAP_MAX_NEAR_SHARE;
  const span = windowAround(input.series, first.start, first.end);
  const edited = { ...windowSettings(input, span), occupied_cells: cells };
  const { gain, digest } = compareEvidence(input, run, edited, first.start, first.end);
  const counterfactual: CounterfactualRun = {
    label: `Map with ${cells.length} cells under the object marked occupied`,
    settings: edited,
    digest,
    metric: 'gain in median log-likelihood per measurement over the first sighting (nats)',
    value: gain,
    supports: cells.length > 0 && gain >= MAP_MIN_GAIN && !isOnSensor,
  };
  const size = flag.size ?? 0;
  const isStructure = size >= OBJECT_STRUCTURE_SIZE;
  const seconds = first.end - first.start;
  const strength = Math.min(1, seconds / FULL_VIEW_SECONDS) * (isStructure ? 1 : 0.5);
  return {
    kind: 'map_changed',
    start: flag.start,
    end: flag.end,
    strength,
    evidence:
      `Free-floor endpoints stayed on the same world cells for ${fixed(seconds)} s across poses: an object about ${fixed(size)} m across at ` +
      `(${fixed(flag.location!.x)}, ${fixed(flag.location!.y)}) m on ${flag.sightings?.length ?? 1} pass(es); ` +
      `with ${cells.length} map cells there marked occupied the scans fit ${fixed(gain, 2)} nats per measurement ${gain >= 0 ? 'better' : 'worse'}.`,
    against: [
      isOnSensor
        ? `${fixed(nearShare * 100, 0)} % of its endpoints lay within ${SHORT_RANGE} m of the robot wherever it was: they travel with the sensor, not with the site.`
        : '',
      isStructure
        ? ''
        : `At ${fixed(size)} m across it is person- or pallet-sized rather than part of the site.`,
      counterfactual.supports
        ? ''
        : `Marking the cells occupied gained only ${fixed(gain, 2)} nats per measurement (at least ${MAP_MIN_GAIN} needed).`,
    ]
      .filter(Boolean)
      .join(' '),
    counterfactuals: [counterfactual],
    gain,
  };
}

function movingObstacles(flag: CauseFlag): ScoredCause {
  return {
    kind: 'moving_obstacles',
    start: flag.start,
    end: flag.end,
    strength: MOVER_STRENGTH,
    evidence: flag.evidence,
    against:
      'No counterfactual is run for something moving: it is context for the other causes, not a fault.',
    counterfactuals: [],
    gain: Number.NaN,
  };
}

/** Candidate map changes (one per unmapped static object) and passing movers. */
export function findMapCauses(input: CauseInput, run: RunCounterfactual): ScoredCause[] {
  const causes: ScoredCause[] = [];
  for (const flag of input.flags) {
    if (flag.kind === 'map_out_of_date' && flag.location) causes.push(mapChanged(input, run, flag));
    else if (flag.kind === 'moving_obstacle') causes.push(movingObstacles(flag));
  }
  return causes;
}
