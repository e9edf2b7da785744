/**
 * Where a scan endpoint lands on the map, by the likelihood field's distance to the nearest
 * obstacle and the map's own cells: the shared test of map_out_of_date and the unmapped-object
 * grouping.
 */
import { CELL_FREE } from '../../bundle/types';
import type { ReplayContext } from '../replay-context';
import { DISAGREEMENT_SIGMAS } from '../scan-endpoints';

/** Where one endpoint (map frame, m) lands: 0 neither, 1 within sigma_hit of an obstacle, 2 on a far free cell. */
export type EndpointClass = 0 | 1 | 2;

/** Classifies an endpoint by the likelihood field's distances and the map's cells (see countFreeSpaceEndpoints). */
export function classifyEndpoint(context: ReplayContext, x: number, y: number): EndpointClass {
  const { field } = context;
  const grid = context.bundle.map.grid;
  const model = context.settings.scan_model;
  if (!field || !grid || !model) return 0;
  const column = Math.floor((x - field.originX) * field.inverseResolution);
  const southRow = Math.floor((y - field.originY) * field.inverseResolution);
  if (column < 0 || column >= field.width || southRow < 0 || southRow >= field.height) return 0;
  const distance = field.distance[southRow * field.width + column];
  if (distance <= model.sigma_hit) return 1;
  if (
    distance > DISAGREEMENT_SIGMAS * model.sigma_hit &&
    grid.cells[(field.height - 1 - southRow) * field.width + column] === CELL_FREE
  )
    return 2;
  return 0;
}
