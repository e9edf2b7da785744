import { isNormalisedAngle, parseDecimal, splitCsvLine } from './csv-fields';
import { quoteFound } from './format-issue';
import { GrowableArray } from './growable-array';
import type { IssueCollector } from './issue-collector';

/**
 * `time`: seconds since start_time, >= 0, ordered per the table's rule; `angle`: radians in (-pi, pi];
 * `category`: one of the spec's categories, stored as its index.
 */
export type CsvColumnKind = 'time' | 'number' | 'non_negative' | 'angle' | 'text' | 'category';

export interface CsvColumnSpec {
  name: string;
  kind: CsvColumnKind;
}

export interface CsvTableSpec {
  columns: readonly CsvColumnSpec[];
  /** Columns that may follow the required ones, all together or not at all. */
  optionalColumns?: readonly CsvColumnSpec[];
  /** `strict`: each t greater than the previous; `non_decreasing`: repeats allowed (events). */
  timeOrder: 'strict' | 'non_decreasing';
  /** A table that is useless when empty (odometry) reports a header-only file. */
  requireRows?: boolean;
  /** Allowed values of `category` columns; undefined accepts any value and stores -1. */
  categories?: readonly string[];
}

/** Parsed columns by name; rows with any problem are left out (the issues say which). */
export interface CsvColumns {
  rowCount: number;
  hasOptionalColumns: boolean;
  numbers: Record<string, Float64Array>;
  texts: Record<string, string[]>;
  categories: Record<string, Int32Array>;
}

export interface CsvTableReader {
  pushLine(text: string, lineNumber: number): void;
  /** Columns, or undefined when the header was missing or wrong. */
  finish(): CsvColumns | undefined;
}

type ColumnStore = GrowableArray<Float64Array> | GrowableArray<Int32Array> | string[];

/**
 * Incremental reader for one CSV table of a bundle: feed it line by line (line 1 = header)
 * and it checks each value as it goes, so a large file is never held as text.
 */
export function createCsvTableReader(
  fileName: string,
  spec: CsvTableSpec,
  issues: IssueCollector,
): CsvTableReader {
  let columns: readonly CsvColumnSpec[] | undefined;
  let stores: ColumnStore[] = [];
  let headerSeen = false;
  let rowCount = 0;
  let dataLineCount = 0;
  let previousTime: number | undefined;
  const blankLines: number[] = [];
  const categoryIndex = new Map((spec.categories ?? []).map((name, index) => [name, index]));
  const values: (number | string)[] = [];

  const report = (
    line: number,
    field: string | undefined,
    message: string,
    expected?: string,
    found?: string,
  ) => issues.add({ file: fileName, line, field, message, expected, found });

  function readHeader(text: string, lineNumber: number): void {
    headerSeen = true;
    const names = text.split(',').map((name) => name.trim());
    const required = spec.columns.map((column) => column.name);
    const withOptional = [...spec.columns, ...(spec.optionalColumns ?? [])];
    if (sameNames(names, required)) columns = spec.columns;
    else if (
      spec.optionalColumns &&
      sameNames(
        names,
        withOptional.map((column) => column.name),
      )
    )
      columns = withOptional;
    if (!columns) {
      const expected = spec.optionalColumns
        ? `${required.join(',')} or ${withOptional.map((column) => column.name).join(',')}`
        : required.join(',');
      report(
        lineNumber,
        'header',
        'header does not match the expected columns',
        expected,
        quoteFound(text, 120),
      );
      return;
    }
    stores = columns.map((column) => {
      if (column.kind === 'text') return [];
      if (column.kind === 'category') return new GrowableArray(Int32Array);
      return new GrowableArray(Float64Array);
    });
  }

  function parseField(column: CsvColumnSpec, raw: string, lineNumber: number): number | string | undefined {
    if (column.kind === 'text') return raw.trim();
    if (column.kind === 'category') {
      const value = raw.trim();
      if (!spec.categories) return -1;
      const index = categoryIndex.get(value);
      if (index === undefined) {
        report(
          lineNumber,
          column.name,
          'unknown class',
          `one of ${spec.categories.join(', ')}`,
          quoteFound(value),
        );
      }
      return index;
    }
    const parsed = parseDecimal(raw);
    if (!parsed.ok) {
      report(lineNumber, column.name, parsed.message, 'a finite decimal number', quoteFound(raw));
      return undefined;
    }
    const value = parsed.value;
    if ((column.kind === 'time' || column.kind === 'non_negative') && value < 0) {
      report(lineNumber, column.name, `${column.name} is negative`, '>= 0', raw.trim());
      return undefined;
    }
    if (column.kind === 'angle' && !isNormalisedAngle(value)) {
      report(lineNumber, column.name, 'angle outside (-pi, pi]', 'radians in (-pi, pi]', raw.trim());
      return undefined;
    }
    return value;
  }

  function checkTimeOrder(column: CsvColumnSpec, value: number, lineNumber: number): boolean {
    const previous = previousTime;
    previousTime = value;
    if (previous === undefined) return true;
    if (spec.timeOrder === 'strict' ? value > previous : value >= previous) return true;
    const isStrict = spec.timeOrder === 'strict';
    const message = isStrict
      ? `${column.name} is not strictly increasing`
      : `${column.name} goes backwards in time`;
    report(lineNumber, column.name, message, isStrict ? `> ${previous}` : `>= ${previous}`, String(value));
    return false;
  }

  function readRow(text: string, lineNumber: number): void {
    if (!columns) return;
    dataLineCount++;
    const split = splitCsvLine(text);
    if (!split.ok) {
      report(lineNumber, undefined, split.message);
      return;
    }
    if (split.fields.length !== columns.length) {
      report(
        lineNumber,
        undefined,
        'wrong column count',
        `${columns.length} (${columnNames(columns)})`,
        String(split.fields.length),
      );
      return;
    }
    values.length = 0;
    let isRowValid = true;
    for (let index = 0; index < columns.length; index++) {
      const column = columns[index];
      const value = parseField(column, split.fields[index], lineNumber);
      if (value === undefined) isRowValid = false;
      else if (column.kind === 'time' && !checkTimeOrder(column, value as number, lineNumber))
        isRowValid = false;
      values.push(value as number | string);
    }
    if (!isRowValid) return;
    for (let index = 0; index < columns.length; index++) {
      const store = stores[index];
      if (Array.isArray(store)) store.push(values[index] as string);
      else store.push(values[index] as number);
    }
    rowCount++;
  }

  return {
    pushLine(text, lineNumber) {
      if (text.trim() === '') {
        blankLines.push(lineNumber);
        return;
      }
      // A blank line is harmless only at the end of the file; here it was followed by more data.
      for (const blank of blankLines.splice(0)) report(blank, undefined, 'empty line inside the table');
      if (!headerSeen) readHeader(text, lineNumber);
      else readRow(text, lineNumber);
    },
    finish() {
      if (!headerSeen) {
        report(1, 'header', 'file is empty', columnNames(spec.columns), 'no lines');
        return undefined;
      }
      if (!columns) return undefined;
      if (spec.requireRows && dataLineCount === 0) {
        report(2, undefined, 'table has a header but no data rows', 'at least one row', '0 rows');
      }
      const result: CsvColumns = {
        rowCount,
        hasOptionalColumns: columns.length > spec.columns.length,
        numbers: {},
        texts: {},
        categories: {},
      };
      columns.forEach((column, index) => {
        const store = stores[index];
        if (Array.isArray(store)) result.texts[column.name] = store;
        else if (column.kind === 'category') result.categories[column.name] = store.toArray() as Int32Array;
        else result.numbers[column.name] = store.toArray() as Float64Array;
      });
      return result;
    },
  };
}

function sameNames(found: string[], expected: string[]): boolean {
  return found.length === expected.length && found.every((name, index) => name === expected[index]);
}

function columnNames(columns: readonly CsvColumnSpec[]): string {
  return columns.map((column) => column.name).join(',');
}
