import { quoteFound } from './format-issue';
import { GrowableArray } from './growable-array';
import type { IssueCollector } from './issue-collector';
import type { ScanTable } from './types';

export interface ScanReader {
  pushLine(text: string, lineNumber: number): void;
  finish(): ScanTable | undefined;
}

const FILE = 'scans.ndjson';

/**
 * Incremental reader for scans.ndjson: one `{"t": s, "ranges": [m | null, ...]}` per line.
 * `expectedBeams` is manifest.scan.beams; undefined (manifest unreadable) takes the first
 * scan's length so the rest of the file is still checked for consistency.
 */
export function createScanReader(expectedBeams: number | undefined, issues: IssueCollector): ScanReader {
  let beams = expectedBeams;
  const times = new GrowableArray(Float64Array);
  const ranges = new GrowableArray(Float32Array, 64 * 1024);
  let previousTime: number | undefined;
  let pendingBlank: number[] = [];
  let row = new Float32Array(beams ?? 0);

  const report = (
    line: number,
    field: string | undefined,
    message: string,
    expected?: string,
    found?: string,
  ) => issues.add({ file: FILE, line, field, message, expected, found });

  function readRanges(list: unknown[], lineNumber: number): boolean {
    if (row.length !== list.length) row = new Float32Array(list.length);
    let isValid = true;
    for (let k = 0; k < list.length; k++) {
      const value = list[k];
      if (value === null) {
        row[k] = Number.NaN;
      } else if (typeof value !== 'number') {
        report(
          lineNumber,
          `ranges[${k}]`,
          'range is not a number or null',
          'metres or null',
          quoteFound(JSON.stringify(value)),
        );
        isValid = false;
      } else if (value < 0) {
        report(lineNumber, `ranges[${k}]`, 'range is negative', '>= 0 or null', String(value));
        isValid = false;
      } else {
        row[k] = value;
      }
    }
    return isValid;
  }

  function readScan(text: string, lineNumber: number): void {
    let record: unknown;
    try {
      record = JSON.parse(text);
    } catch (error) {
      report(lineNumber, undefined, `not valid JSON: ${(error as Error).message}`);
      return;
    }
    if (typeof record !== 'object' || record === null || Array.isArray(record)) {
      report(
        lineNumber,
        undefined,
        'line is not a JSON object',
        '{"t": ..., "ranges": [...]}',
        quoteFound(text),
      );
      return;
    }
    const { t, ranges: list } = record as { t?: unknown; ranges?: unknown };
    let isValid = true;
    if (typeof t !== 'number') {
      report(
        lineNumber,
        't',
        't is missing or not a number',
        'seconds since start_time',
        quoteFound(JSON.stringify(t) ?? 'missing'),
      );
      isValid = false;
    } else if (t < 0) {
      report(lineNumber, 't', 't is negative', '>= 0', String(t));
      isValid = false;
    } else {
      if (previousTime !== undefined && t <= previousTime) {
        report(lineNumber, 't', 't is not strictly increasing', `> ${previousTime}`, String(t));
        isValid = false;
      }
      previousTime = t;
    }
    if (!Array.isArray(list)) {
      report(
        lineNumber,
        'ranges',
        'ranges is missing or not an array',
        'an array of metres or null',
        quoteFound(JSON.stringify(list) ?? 'missing'),
      );
      return;
    }
    if (beams === undefined) beams = list.length;
    if (list.length !== beams) {
      const origin = expectedBeams === undefined ? 'the first scan' : 'manifest.scan.beams';
      report(lineNumber, 'ranges', `wrong number of ranges (${origin})`, String(beams), String(list.length));
      return;
    }
    if (!readRanges(list, lineNumber) || !isValid) return;
    times.push(t as number);
    ranges.pushAll(row);
  }

  return {
    pushLine(text, lineNumber) {
      if (text.trim() === '') {
        pendingBlank.push(lineNumber);
        return;
      }
      for (const blank of pendingBlank) report(blank, undefined, 'empty line inside the file');
      pendingBlank = [];
      readScan(text, lineNumber);
    },
    finish() {
      return { t: times.toArray(), count: times.length, beams: beams ?? 0, ranges: ranges.toArray() };
    },
  };
}
