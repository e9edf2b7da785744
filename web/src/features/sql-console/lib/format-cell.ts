import type { QueryCell } from '@shared/query-result-hash';

/** How a cell reads in the table and in CSV. */
export function formatCell(cell: QueryCell): string {
  if (cell === null) return '';
  if (typeof cell === 'object') return JSON.stringify(cell);
  return String(cell);
}
