import { canonicalJson } from './canonical-json';
import { sha256Hex } from './engine/sha256';

/**
 * The hash of a SQL query result that a saved query carries as evidence. The browser computes it
 * after running the query; the server, the evidence archive and its offline verifier recompute it
 * the same way.
 *
 * Canonical form: the UTF-8 bytes of the RFC 8785 JSON text of `{"columns": [...], "rows": [[...], ...]}`
 * (so "columns" comes before "rows"), one inner array per row in result order, one cell per
 * column. Cells are normalised first:
 * - null and undefined → `null`
 * - bigint (64-bit and wider integers) → its decimal string, e.g. `"9007199254740993"`
 * - `Date` → RFC 3339 UTC text with milliseconds, e.g. `"2026-10-03T06:41:00.000Z"`
 * - finite numbers (including 32-bit floats widened to doubles) → JSON numbers as ECMAScript prints them
 * - NaN, Infinity, -Infinity → the strings `"NaN"`, `"Infinity"`, `"-Infinity"` (JSON has no form for them)
 * - lists (arrays, typed arrays, any iterable such as an Arrow vector) → arrays of normalised cells
 * - structs (plain objects, or objects with `toJSON`) → objects of normalised cells, members sorted
 * - booleans and strings as they are.
 * The hash is SHA-256 (FIPS 180-4) of those bytes, as 64 lowercase hex digits.
 */

/** A result cell after normalisation: exactly what is hashed. */
export type QueryCell = null | boolean | number | string | QueryCell[] | { [key: string]: QueryCell };

export class QueryResultError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'QueryResultError';
  }
}

/** Turns one result value into its canonical cell; `where` names it in errors (e.g. `row 3, column "t"`). */
export function normaliseQueryCell(value: unknown, where = 'cell'): QueryCell {
  if (value === null || value === undefined) return null;
  switch (typeof value) {
    case 'boolean':
    case 'string':
      return value;
    case 'bigint':
      return value.toString(10);
    case 'number':
      if (Number.isFinite(value)) return value;
      return Number.isNaN(value) ? 'NaN' : value > 0 ? 'Infinity' : '-Infinity';
    case 'object':
      return normaliseObject(value, where);
    default:
      throw new QueryResultError(`${where}: a ${typeof value} cannot be part of a query result`);
  }
}

function normaliseObject(value: object, where: string): QueryCell {
  if (value instanceof Date) {
    if (Number.isNaN(value.getTime())) throw new QueryResultError(`${where}: invalid date`);
    return value.toISOString();
  }
  if (Array.isArray(value) || ArrayBuffer.isView(value)) {
    return Array.from(value as ArrayLike<unknown>, (item, index) =>
      normaliseQueryCell(item, `${where}[${index}]`),
    );
  }
  const withToJson = value as { toJSON?: () => unknown };
  if (typeof withToJson.toJSON === 'function') return normaliseQueryCell(withToJson.toJSON(), where);
  if (Symbol.iterator in value) {
    return Array.from(value as Iterable<unknown>, (item, index) =>
      normaliseQueryCell(item, `${where}[${index}]`),
    );
  }
  const record: { [key: string]: QueryCell } = {};
  for (const [key, item] of Object.entries(value)) record[key] = normaliseQueryCell(item, `${where}.${key}`);
  return record;
}

/** Normalises every cell of a result; rows must have one cell per column. */
export function normaliseQueryRows(
  columns: readonly string[],
  rows: readonly (readonly unknown[])[],
): QueryCell[][] {
  return rows.map((row, rowIndex) => {
    if (row.length !== columns.length) {
      throw new QueryResultError(
        `row ${rowIndex}: has ${row.length} cells but the result has ${columns.length} columns`,
      );
    }
    return row.map((cell, columnIndex) =>
      normaliseQueryCell(cell, `row ${rowIndex}, column "${columns[columnIndex]}"`),
    );
  });
}

/** The canonical JSON text of a result (see the file comment); hash its UTF-8 bytes. */
export function canonicalQueryResult(
  columns: readonly string[],
  rows: readonly (readonly unknown[])[],
): string {
  return canonicalJson({ columns: [...columns], rows: normaliseQueryRows(columns, rows) });
}

/** SHA-256 of the canonical result, as 64 lowercase hex digits. */
export function queryResultSha256(columns: readonly string[], rows: readonly (readonly unknown[])[]): string {
  return sha256Hex(new TextEncoder().encode(canonicalQueryResult(columns, rows)));
}
