/** Result of splitting one CSV line: the fields, or why the line could not be split. */
export type SplitCsvResult = { ok: true; fields: string[] } | { ok: false; message: string };

/**
 * Splits one CSV line (RFC 4180 quoting: `"a, b"` and `""` for a literal quote). Fields cannot
 * span lines: the bundle readers are line-based, so a newline inside a quoted field is reported
 * as an unterminated quote on its first line.
 */
export function splitCsvLine(line: string): SplitCsvResult {
  if (!line.includes('"')) return { ok: true, fields: line.split(',') };
  const fields: string[] = [];
  let field = '';
  let index = 0;
  let atFieldStart = true;
  while (index < line.length) {
    const char = line[index];
    if (atFieldStart && char === '"') {
      const close = readQuoted(line, index + 1);
      if (!close)
        return {
          ok: false,
          message: 'unterminated quoted field (a quoted value cannot contain a line break)',
        };
      field = close.value;
      index = close.next;
      if (index < line.length && line[index] !== ',') {
        return { ok: false, message: `unexpected text after a closing quote at column ${index + 1}` };
      }
      atFieldStart = false;
      continue;
    }
    if (char === ',') {
      fields.push(field);
      field = '';
      atFieldStart = true;
    } else {
      field += char;
      atFieldStart = false;
    }
    index++;
  }
  fields.push(field);
  return { ok: true, fields };
}

function readQuoted(line: string, start: number): { value: string; next: number } | undefined {
  let value = '';
  let index = start;
  while (index < line.length) {
    const quote = line.indexOf('"', index);
    if (quote === -1) return undefined;
    value += line.slice(index, quote);
    if (line[quote + 1] === '"') {
      value += '"';
      index = quote + 2;
    } else {
      return { value, next: quote + 1 };
    }
  }
  return undefined;
}

const DECIMAL_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NOT_FINITE_WORDS = /^[+-]?(nan|inf|infinity)$/i;

export type ParsedNumber = { ok: true; value: number } | { ok: false; message: string };

/**
 * Parses a decimal number strictly: `Number()` would accept '', ' ', '0x1f' and 'Infinity',
 * all of which in a log mean something went wrong upstream.
 */
export function parseDecimal(text: string): ParsedNumber {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: false, message: 'empty value where a number is required' };
  if (NOT_FINITE_WORDS.test(trimmed)) return { ok: false, message: 'NaN or infinite value' };
  if (!DECIMAL_NUMBER.test(trimmed)) return { ok: false, message: 'not a number' };
  const value = Number(trimmed);
  if (!Number.isFinite(value)) return { ok: false, message: 'NaN or infinite value (number too large)' };
  return { ok: true, value };
}

/** Round-off allowance above pi: a writer printing pi to 12 digits produces 3.14159265359 > Math.PI. */
const ANGLE_TOLERANCE = 1e-9;

/**
 * True when an angle in radians lies in (-pi, pi]. Only the closed end gets a round-off
 * allowance; -pi itself belongs to the other end and must be written as +pi.
 */
export function isNormalisedAngle(radians: number): boolean {
  return radians > -Math.PI && radians <= Math.PI + ANGLE_TOLERANCE;
}
