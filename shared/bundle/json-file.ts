import type { z } from 'zod';
import { quoteFound } from './format-issue';
import type { IssueCollector } from './issue-collector';
import { findJsonErrorOffset } from './json-error-position';

/** Renders a zod path as the JSON path people read: `detector.confusion[1]`. */
export function formatJsonPath(path: readonly PropertyKey[]): string {
  let text = '';
  for (const key of path) {
    if (typeof key === 'number') text += `[${key}]`;
    else text += text === '' ? String(key) : `.${String(key)}`;
  }
  return text === '' ? '(root)' : text;
}

/** Parses a JSON file, reporting a syntax error with its line (V8 gives a character position). */
export function parseJsonText(file: string, text: string, issues: IssueCollector): unknown {
  if (text.trim() === '') {
    issues.add({ file, message: 'file is empty', expected: 'a JSON object' });
    return undefined;
  }
  try {
    return JSON.parse(text.charCodeAt(0) === 0xfeff ? text.slice(1) : text);
  } catch (error) {
    const offset = findJsonErrorOffset(text);
    const line = offset === undefined ? undefined : lineAt(text, offset);
    issues.add({ file, line, message: `not valid JSON: ${(error as Error).message}` });
    return undefined;
  }
}

function lineAt(text: string, offset: number): number {
  let line = 1;
  for (let index = 0; index < offset && index < text.length; index++)
    if (text.charCodeAt(index) === 10) line++;
  return line;
}

function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let value = input;
  for (const key of path) {
    if (typeof value !== 'object' || value === null) return undefined;
    value = (value as Record<PropertyKey, unknown>)[key];
  }
  return value;
}

function describeFound(value: unknown): string {
  if (value === undefined) return 'missing';
  return quoteFound(JSON.stringify(value), 60);
}

/** Validates `input` with a zod schema, turning each zod issue into a located bundle issue. */
export function parseWithSchema<T>(
  file: string,
  schema: z.ZodType<T>,
  input: unknown,
  issues: IssueCollector,
): T | undefined {
  const result = schema.safeParse(input);
  if (result.success) return result.data;
  for (const issue of result.error.issues) {
    const isUnknownKeys = issue.code === 'unrecognized_keys';
    const expected = 'expected' in issue && typeof issue.expected === 'string' ? issue.expected : undefined;
    issues.add({
      file,
      field: formatJsonPath(issue.path),
      message: isUnknownKeys ? `unknown field(s): ${issue.keys.join(', ')}` : issue.message,
      expected,
      found: isUnknownKeys ? undefined : describeFound(valueAt(input, issue.path)),
    });
  }
  return undefined;
}
