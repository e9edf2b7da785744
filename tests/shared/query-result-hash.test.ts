import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  canonicalQueryResult,
  normaliseQueryCell,
  QueryResultError,
  queryResultSha256,
} from '../../shared/query-result-hash';

/** Reference digest from Node's OpenSSL-backed SHA-256, independent of the project's own implementation. */
const nodeSha256 = (text: string) => createHash('sha256').update(text, 'utf8').digest('hex');

describe('queryResultSha256', () => {
  it('hashes the documented canonical bytes (checked against Node crypto)', () => {
    const columns = ['t', 'kind', 'detail'];
    const rows = [
      [12.5, 'contact', 'bumper'],
      [13, 'protective_stop', null],
    ];
    // The canonical text written out by hand: "columns" sorts before "rows", no whitespace.
    const expected =
      '{"columns":["t","kind","detail"],"rows":[[12.5,"contact","bumper"],[13,"protective_stop",null]]}';
    expect(canonicalQueryResult(columns, rows)).toBe(expected);
    expect(queryResultSha256(columns, rows)).toBe(nodeSha256(expected));
  });

  it('normalises BigInt to decimal strings and dates to RFC 3339 UTC', () => {
    const rows = [[9007199254740993n, new Date(Date.UTC(2026, 9, 3, 6, 41, 0))]];
    // 2^53 + 1 is the first integer a double cannot hold, so it must travel as text (common practice).
    const expected = '{"columns":["n","at"],"rows":[["9007199254740993","2026-10-03T06:41:00.000Z"]]}';
    expect(canonicalQueryResult(['n', 'at'], rows)).toBe(expected);
    expect(queryResultSha256(['n', 'at'], rows)).toBe(nodeSha256(expected));
  });

  it('prints numbers as ECMAScript does, per RFC 8785 section 3.2.2.3', () => {
    // RFC 8785, Appendix B sample values (value from memory): 1e21 → 1e+21, 1e-7 → 1e-7,
    // 0.000001 → 0.000001, -0 → 0.
    const rows = [[1e21, 1e-7, 0.000001, -0]];
    expect(canonicalQueryResult(['a', 'b', 'c', 'd'], rows)).toBe(
      '{"columns":["a","b","c","d"],"rows":[[1e+21,1e-7,0.000001,0]]}',
    );
  });

  it('sorts struct members by UTF-16 code units, per RFC 8785 section 3.2.3', () => {
    // RFC 8785 section 3.2.3 sorting example keys: "\r", "1", "\u0080", "\u00f6", "\u20ac", "\ud83d\ude00", "\ufb33".
    const struct = { '\u20ac': 1, '\r': 2, '\ufb33': 3, '1': 4, '\ud83d\ude00': 5, '\u0080': 6, '\u00f6': 7 };
    const text = canonicalQueryResult(['s'], [[struct]]);
    const keys = Object.keys(JSON.parse(text).rows[0][0]);
    // Object.keys lists integer-like keys first, so compare the order in the text instead.
    const order = ['\r', '1', '\u0080', '\u00f6', '\u20ac', '\ud83d\ude00', '\ufb33'].map((k) =>
      text.indexOf(JSON.stringify(k)),
    );
    expect(order).toEqual([...order].sort((a, b) => a - b));
    expect(keys).toHaveLength(7);
  });

  it('keeps 32-bit floats as their exact double value and lists as arrays', () => {
    const ranges = new Float32Array([0.1, 2.5]);
    const cell = normaliseQueryCell(ranges);
    // 0.1 as an IEEE 754 single is 0.100000001490116119384765625 (IEEE 754-2008 binary32 rounding).
    expect(cell).toEqual([0.10000000149011612, 2.5]);
  });

  it('writes non-finite numbers as text, since JSON has none', () => {
    expect([NaN, Infinity, -Infinity].map((v) => normaliseQueryCell(v))).toEqual([
      'NaN',
      'Infinity',
      '-Infinity',
    ]);
  });

  it('changes when one cell or the row order changes', () => {
    const base = queryResultSha256(['x'], [[1], [2]]);
    expect(queryResultSha256(['x'], [[2], [1]])).not.toBe(base);
    expect(queryResultSha256(['x'], [[1], [3]])).not.toBe(base);
    expect(queryResultSha256(['y'], [[1], [2]])).not.toBe(base);
  });

  it('names the row and column of a row with the wrong width', () => {
    expect(() => queryResultSha256(['a', 'b'], [[1, 2], [3]])).toThrow(QueryResultError);
    expect(() => queryResultSha256(['a', 'b'], [[1, 2], [3]])).toThrow(/row 1: has 1 cells/);
    expect(() => normaliseQueryCell(() => 1, 'row 0, column "f"')).toThrow(/row 0, column "f"/);
  });
});
