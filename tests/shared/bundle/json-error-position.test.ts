import { describe, expect, it } from 'vitest';
import { findJsonErrorOffset } from '../../../shared/bundle/json-error-position';

describe('findJsonErrorOffset', () => {
  // Agreement with the reference parser: whatever JSON.parse (ECMA-404) accepts has no error offset.
  it.each(['{}', '[]', '{"a":[1,-2.5e3,true,false,null,"x\\"y"]}', ' 0 ', '"\\u00e9"'])(
    'accepts %s like JSON.parse',
    (text) => {
      expect(() => JSON.parse(text)).not.toThrow();
      expect(findJsonErrorOffset(text)).toBeUndefined();
    },
  );

  it.each([
    ['{"a": }', 6],
    ['{"a": 1,}', 8],
    ['[1 2]', 3],
    ['{"a": 01}', 7],
    ['{"a": 1', 7],
    ['{"a": 1} x', 9],
    ["{'a': 1}", 1],
  ])('locates the error in %s at offset %i, where JSON.parse also fails', (text, offset) => {
    expect(() => JSON.parse(text)).toThrow();
    expect(findJsonErrorOffset(text)).toBe(offset);
  });
});
