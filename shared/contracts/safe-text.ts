import { z } from 'zod';

/**
 * Text that can be stored and hashed as written. PostgreSQL text and jsonb refuse the NUL
 * character, and a UTF-16 surrogate without its partner has no UTF-8 form (drivers silently
 * replace it), so both are refused at the edge with the field named, never found by the database.
 */

const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/;

const codePoint = (char: string) => `U+${char.charCodeAt(0).toString(16).toUpperCase().padStart(4, '0')}`;

/** Why `text` cannot be stored, in plain words, or null when it can. */
export function unsafeTextReason(text: string): string | null {
  const nul = text.indexOf('\u0000');
  if (nul >= 0) return `must not contain the NUL character (U+0000); found at character ${nul + 1}`;
  const lone = LONE_SURROGATE.exec(text);
  if (lone) {
    return `must not contain a lone UTF-16 surrogate (${codePoint(lone[0])}), which is not valid Unicode; found at character ${lone.index + 1}`;
  }
  return null;
}

export const isSafeText = (text: string): boolean => unsafeTextReason(text) === null;

/**
 * Shows a text (e.g. an unknown field name) with NUL, other control characters and lone
 * surrogates written as `\uXXXX`, so a message about it is itself safe to store and read.
 */
export function printableText(text: string): string {
  return text.replace(
    // biome-ignore lint/suspicious/noControlCharactersInRegex: escaping control characters is the point.
    /[\u0000-\u001f\u007f]|[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/g,
    (char) => `\\u${char.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
}

/**
 * `z.string()` that refuses NUL and lone surrogates. Every text field of a request (body, query
 * string, record key) is built from this; chain `.trim().min().max()` after it as usual. `error`
 * words the refusal of a missing or non-text value, which zod would otherwise call "expected string".
 */
export function safeText(params?: { error: string }) {
  return z.string(params).superRefine((text, ctx) => {
    const reason = unsafeTextReason(text);
    if (reason) ctx.addIssue({ code: 'custom', message: `Text ${reason}` });
  });
}

export type SafeJsonValue =
  | null
  | boolean
  | number
  | string
  | SafeJsonValue[]
  | { [key: string]: SafeJsonValue };

/** Free-form JSON in a request (e.g. changed settings, query result cells): every string and key is safe text. */
export const ZSafeJsonValue: z.ZodType<SafeJsonValue> = z.lazy(() =>
  z.union([
    z.null(),
    z.boolean(),
    z.number(),
    safeText(),
    z.array(ZSafeJsonValue),
    z.record(safeText(), ZSafeJsonValue),
  ]),
);
