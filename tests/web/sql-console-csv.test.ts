import { resultToCsv } from '@web/features/sql-console/lib/result-csv';
import { describe, expect, it } from 'vitest';

describe('resultToCsv', () => {
  it('quotes fields with commas, quotes and line breaks and ends lines with CRLF (RFC 4180 section 2)', () => {
    const csv = resultToCsv(
      ['t', 'detail'],
      [
        [21.5, 'obstacle entered slow-down field, right side'],
        [22, 'operator said "stop"'],
        [23, 'two\nlines'],
      ],
    );
    // RFC 4180 section 2, rules 1, 6 and 7: CRLF line ends; quoted fields; inner quotes doubled.
    expect(csv).toBe(
      't,detail\r\n21.5,"obstacle entered slow-down field, right side"\r\n22,"operator said ""stop"""\r\n23,"two\nlines"\r\n',
    );
  });

  it('writes null as an empty field and lists as JSON text', () => {
    expect(resultToCsv(['a', 'b'], [[null, [1.5, null]]])).toBe('a,b\r\n,"[1.5,null]"\r\n');
  });
});
