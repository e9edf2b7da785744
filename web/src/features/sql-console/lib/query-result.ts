import { normaliseQueryCell, type QueryCell } from '@shared/query-result-hash';
import { DataType, tableFromIPC } from 'apache-arrow';

export interface ResultColumn {
  name: string;
  /** Arrow type as DuckDB sent it, e.g. Float64, Utf8, List<Float32>. */
  type: string;
}

/** A query result with every cell already in the canonical form that is shown, exported and hashed. */
export interface QueryResult {
  columns: ResultColumn[];
  rows: QueryCell[][];
}

function isTemporal(type: DataType): boolean {
  return DataType.isDate(type) || DataType.isTimestamp(type);
}

/**
 * Decodes DuckDB's Arrow IPC bytes with this app's Arrow and normalises the cells. Only the lazily
 * loaded DuckDB module imports this, so Arrow stays out of the main bundle.
 */
export function readQueryResult(ipcBytes: Uint8Array): QueryResult {
  const table = tableFromIPC(ipcBytes);
  const fields = table.schema.fields;
  const vectors = fields.map((_, index) => table.getChildAt(index));
  const rows: QueryCell[][] = [];
  for (let row = 0; row < table.numRows; row++) {
    rows.push(
      fields.map((field, index) => {
        const value = vectors[index]?.get(row);
        // Arrow reads dates and timestamps as epoch milliseconds; the canonical form wants RFC 3339.
        const plain =
          isTemporal(field.type) && (typeof value === 'number' || typeof value === 'bigint')
            ? new Date(Number(value))
            : value;
        return normaliseQueryCell(plain, `row ${row}, column "${field.name}"`);
      }),
    );
  }
  return { columns: fields.map((field) => ({ name: field.name, type: String(field.type) })), rows };
}
