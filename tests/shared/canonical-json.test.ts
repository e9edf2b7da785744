import { describe, expect, it } from 'vitest';
import { CanonicalJsonError, canonicalJson } from '../../shared/canonical-json';

/** Reads an IEEE 754 double from its 16 hex digits, as RFC 8785 Appendix B lists them. */
function doubleFromHex(hex: string): number {
  const view = new DataView(new ArrayBuffer(8));
  view.setBigUint64(0, BigInt(`0x${hex}`));
  return view.getFloat64(0);
}

describe('canonicalJson (RFC 8785)', () => {
  it('serializes the sample of RFC 8785 §3.2.2', () => {
    // RFC 8785 §3.2.2, input and expected output as printed there.
    const input = JSON.parse(
      '{"numbers": [333333333.33333329, 1E30, 4.50, 2e-3, 0.000000000000000000000000001],' +
        ' "string": "\\u20ac$\\u000F\\u000aA\'\\u0042\\u0022\\u005c\\\\\\"\\/",' +
        ' "literals": [null, true, false]}',
    );
    expect(canonicalJson(input)).toBe(
      '{"literals":[null,true,false],"numbers":[333333333.3333333,1e+30,4.5,0.002,1e-27],' +
        '"string":"€$\\u000f\\nA\'B\\"\\\\\\\\\\"/"}',
    );
  });

  it('sorts members by UTF-16 code units as in RFC 8785 §3.2.3', () => {
    // RFC 8785 §3.2.3: the sorting example and the order of its values.
    const input = {
      '\u20ac': 'Euro Sign',
      '\r': 'Carriage Return',
      '\ufb33': 'Hebrew Letter Dalet With Dagesh',
      '1': 'One',
      '\ud83d\ude00': 'Emoji: Grinning Face',
      '\u0080': 'Control',
      '\u00f6': 'Latin Small Letter O With Diaeresis',
    };
    const order = [...canonicalJson(input).matchAll(/:"([^"]+)"/g)].map((m) => m[1]);
    expect(order).toEqual([
      'Carriage Return',
      'One',
      'Control',
      'Latin Small Letter O With Diaeresis',
      'Euro Sign',
      'Emoji: Grinning Face',
      'Hebrew Letter Dalet With Dagesh',
    ]);
  });

  // RFC 8785 Appendix B, "Number Serialization Samples" (IEEE 754 hex → expected text).
  const numberSamples: [string, string][] = [
    ['0000000000000000', '0'],
    ['8000000000000000', '0'],
    ['0000000000000001', '5e-324'],
    ['8000000000000001', '-5e-324'],
    ['7fefffffffffffff', '1.7976931348623157e+308'],
    ['ffefffffffffffff', '-1.7976931348623157e+308'],
    ['4340000000000000', '9007199254740992'],
    ['c340000000000000', '-9007199254740992'],
    ['4430000000000000', '295147905179352830000'],
    ['44b52d02c7e14af5', '9.999999999999997e+22'],
    ['44b52d02c7e14af6', '1e+23'],
    ['44b52d02c7e14af7', '1.0000000000000001e+23'],
    ['444b1ae4d6e2ef4e', '999999999999999700000'],
    ['444b1ae4d6e2ef4f', '999999999999999900000'],
    ['444b1ae4d6e2ef50', '1e+21'],
    ['3eb0c6f7a0b5ed8c', '9.999999999999997e-7'],
    ['3eb0c6f7a0b5ed8d', '0.000001'],
    ['41b3de4355555553', '333333333.3333332'],
    ['41b3de4355555554', '333333333.33333325'],
    ['41b3de4355555555', '333333333.3333333'],
    ['41b3de4355555556', '333333333.3333334'],
    ['41b3de4355555557', '333333333.33333343'],
    ['becbf647612f3696', '-0.0000033333333333333333'],
    ['43143ff3c1cb0959', '1424953923781206.2'],
  ];
  it.each(numberSamples)('serializes the double 0x%s as %s (RFC 8785 Appendix B)', (hex, expected) => {
    expect(canonicalJson(doubleFromHex(hex))).toBe(expected);
  });

  it('rejects NaN and Infinity, naming where they are (RFC 8785 §3.2.2.3)', () => {
    expect(() => canonicalJson({ a: [1, doubleFromHex('7fffffffffffffff')] })).toThrow(CanonicalJsonError);
    expect(() => canonicalJson({ a: [1, doubleFromHex('7ff0000000000000')] })).toThrow('$.a[1]');
  });

  it('gives the same text whatever the member order of the input', () => {
    expect(canonicalJson({ b: [{ y: 1, x: 2 }], a: 'z' })).toBe(
      canonicalJson({ a: 'z', b: [{ x: 2, y: 1 }] }),
    );
    expect(canonicalJson({ b: 1, a: undefined })).toBe('{"b":1}');
  });
});
