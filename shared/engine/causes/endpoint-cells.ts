/** Which map cell (map row order, row 0 northmost, as `grid.cells`) a map-frame point (m) falls in. */
import type { ReplayContext } from '../replay-context';

/** The cell index, or -1 outside the grid or without one. */
export function endpointMapCell(context: ReplayContext, x: number, y: number): number {
  const { field } = context;
  if (!field) return -1;
  const column = Math.floor((x - field.originX) * field.inverseResolution);
  const southRow = Math.floor((y - field.originY) * field.inverseResolution);
  if (column < 0 || column >= field.width || southRow < 0 || southRow >= field.height) return -1;
  return (field.height - 1 - southRow) * field.width + column;
}
