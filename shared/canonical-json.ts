/**
 * JSON Canonicalization Scheme (RFC 8785): the one byte-exact serialization that is hashed and
 * signed (findings versions, audit entries), so a verifier in any language can reproduce it.
 *
 * RFC 8785 defines strings and numbers by ECMAScript's JSON serialization, so those parts use
 * `JSON.stringify`; object members are sorted by their UTF-16 code units, which is the order of
 * JavaScript's default string comparison.
 */

/** A value that has a canonical JSON form. */
export type CanonicalJsonValue =
  | null
  | boolean
  | number
  | string
  | readonly CanonicalJsonValue[]
  | { readonly [key: string]: CanonicalJsonValue | undefined };

export class CanonicalJsonError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'CanonicalJsonError';
  }
}

/**
 * Serializes a JSON value per RFC 8785. Object members whose value is `undefined` are left out
 * (as `JSON.stringify` does); NaN, Infinity, bigint, functions and symbols throw, naming the path.
 */
export function canonicalJson(value: unknown): string {
  return serialize(value, '$');
}

function serialize(value: unknown, path: string): string {
  if (value === null) return 'null';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) throw new CanonicalJsonError(`${path}: ${value} has no JSON form`);
    return JSON.stringify(value);
  }
  if (Array.isArray(value)) {
    return `[${value.map((item, index) => serialize(item, `${path}[${index}]`)).join(',')}]`;
  }
  if (typeof value === 'object') {
    const withToJson = value as { toJSON?: () => unknown };
    if (typeof withToJson.toJSON === 'function') return serialize(withToJson.toJSON(), path);
    const record = value as Record<string, unknown>;
    const members = Object.keys(record)
      .filter((key) => record[key] !== undefined)
      .sort()
      .map((key) => `${JSON.stringify(key)}:${serialize(record[key], `${path}.${key}`)}`);
    return `{${members.join(',')}}`;
  }
  throw new CanonicalJsonError(`${path}: a ${typeof value} has no JSON form`);
}
