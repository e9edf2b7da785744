import { describe, expect, it } from 'vitest';
import { isNormalisedAngle, parseDecimal, splitCsvLine } from '../../../shared/bundle/csv-fields';

describe('splitCsvLine', () => {
  // RFC 4180 section 2, rules 5-7: quoted fields may contain commas; a quote inside is doubled.
  it('splits quoted fields with commas and doubled quotes as RFC 4180 section 2 describes', () => {
    expect(splitCsvLine('1.5,contact,"bumper, front ""left"""')).toEqual({
      ok: true,
      fields: ['1.5', 'contact', 'bumper, front "left"'],
    });
  });

  it('keeps empty fields (RFC 4180 section 2, rule 4: each line has the same number of fields)', () => {
    expect(splitCsvLine('1,,3')).toEqual({ ok: true, fields: ['1', '', '3'] });
    expect(splitCsvLine('1,"",3')).toEqual({ ok: true, fields: ['1', '', '3'] });
  });

  it('reports a quote that is never closed', () => {
    const result = splitCsvLine('1,note,"started here');
    expect(result.ok).toBe(false);
  });

  it('reports text after a closing quote', () => {
    expect(splitCsvLine('1,"a"b,2').ok).toBe(false);
  });
});

describe('parseDecimal', () => {
  it.each(['0', '-1.5', '+2', '.5', '3.', '1e-3', '6.02E23'])('accepts the decimal number %s', (text) => {
    expect(parseDecimal(text)).toEqual({ ok: true, value: Number(text) });
  });

  it.each(['NaN', 'nan', 'Infinity', '-inf', '1e999'])('rejects the non-finite value %s', (text) => {
    const parsed = parseDecimal(text);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.message).toMatch(/NaN or infinite/);
  });

  // Number() would accept all of these (ECMA-262 StringToNumber), which is why the parser is strict.
  it.each(['', ' ', '0x1f', '1,5', 'abc', '1.2.3'])(
    'rejects %j, which Number() would read differently',
    (text) => {
      expect(parseDecimal(text).ok).toBe(false);
    },
  );
});

describe('isNormalisedAngle', () => {
  // The format's convention (-pi, pi]: pi belongs to the interval, -pi does not (common practice).
  it('includes pi and excludes -pi', () => {
    expect(isNormalisedAngle(Math.PI)).toBe(true);
    // A writer printing pi to 12 digits slightly overshoots it.
    expect(isNormalisedAngle(Number('3.14159265359'))).toBe(true);
    expect(isNormalisedAngle(-Math.PI)).toBe(false);
    expect(isNormalisedAngle(Number('-3.1415926'))).toBe(true);
    expect(isNormalisedAngle(3.2)).toBe(false);
    expect(isNormalisedAngle(-4)).toBe(false);
  });
});
