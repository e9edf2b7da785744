/**
 * Free travel of the footprint along the direction of travel before it would touch an occupied map
 * cell, found by sphere tracing: moving the footprint by its current clearance can never make it
 * overlap anything, so the search steps by that clearance until it is (nearly) touching.
 */
import type { Footprint } from '../bundle/types';
import { cos, sin } from '../engine/numerics';
import { footprintToGrid, type ObstacleField } from './grid-clearance';

/** Treated as touching (m): the trace stops here. */
const TOUCH = 0.01;
const MAX_STEPS = 400;

/**
 * Free travel (m) from pose (x, y, theta) moving straight ahead (direction 1) or astern (-1), up
 * to `lookahead` m (returned when nothing is nearer). Leaving the grid counts as an obstacle.
 * null when the pose itself is undefined or off the grid.
 */
export function travelOnGrid(
  field: ObstacleField,
  footprint: Footprint,
  x: number,
  y: number,
  theta: number,
  direction: 1 | -1,
  lookahead: number,
): number | null {
  const dx = direction * cos(theta);
  const dy = direction * sin(theta);
  let travelled = 0;
  for (let k = 0; k < MAX_STEPS; k++) {
    const clearance = footprintToGrid(field, footprint, x + travelled * dx, y + travelled * dy, theta);
    if (clearance === null) return k === 0 ? null : travelled;
    if (clearance < TOUCH) return travelled;
    travelled += clearance;
    if (travelled >= lookahead) return lookahead;
  }
  return travelled;
}
