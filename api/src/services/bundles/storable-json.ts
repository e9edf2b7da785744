/** NUL and lone surrogates written as `\uXXXX`; other characters (newlines too) are kept. */
function storableText(text: string): string {
  return text.replace(
    // biome-ignore lint/suspicious/noControlCharactersInRegex: NUL is what jsonb refuses.
    /\u0000|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g,
    (char) => `\\u${char.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
}

/**
 * A copy of `value` whose strings (and object keys) have NUL and lone surrogates written as
 * `\uXXXX`. PostgreSQL's jsonb refuses `\u0000` and unpaired surrogates,
 * and a bundle's file names and messages come from inside an uploaded archive, so anything
 * stored about a bundle passes through here.
 */
export function storableJson<T>(value: T): T {
  if (typeof value === 'string') return storableText(value) as T;
  if (Array.isArray(value)) return value.map((item) => storableJson(item)) as T;
  if (value && typeof value === 'object' && !(value instanceof Date)) {
    return Object.fromEntries(
      Object.entries(value).map(([key, item]) => [storableText(key), storableJson(item)]),
    ) as T;
  }
  return value;
}
