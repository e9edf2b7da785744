import type { z } from 'zod';

/**
 * Where a request contract holds text: the path of every string (free text, e-mail, UUID, enum,
 * date...) with array items as `0`, a record's keys as `{key}` and free-form JSON as `*`. The
 * text-validation test uses it to prove its sample bodies reach every text field.
 */
export function textFieldPaths(schema: z.ZodType, prefix: string[] = []): string[] {
  const def = (schema as unknown as { _zod: { def: Record<string, unknown> & { type: string } } })._zod.def;
  const inner = (key: string) => textFieldPaths(def[key] as z.ZodType, prefix);
  switch (def.type) {
    case 'string':
    case 'enum':
      return [prefix.join('.')];
    case 'literal':
      return (def.values as unknown[]).some((value) => typeof value === 'string') ? [prefix.join('.')] : [];
    case 'object':
      return Object.entries(def.shape as Record<string, z.ZodType>).flatMap(([key, value]) =>
        textFieldPaths(value, [...prefix, key]),
      );
    case 'optional':
    case 'nullable':
    case 'default':
    case 'prefault':
    case 'readonly':
      return inner('innerType');
    case 'pipe':
      return inner('in');
    case 'array':
      return textFieldPaths(def.element as z.ZodType, [...prefix, '0']);
    case 'tuple':
      return (def.items as z.ZodType[]).flatMap((item, index) =>
        textFieldPaths(item, [...prefix, String(index)]),
      );
    case 'union':
      return [...new Set((def.options as z.ZodType[]).flatMap((option) => textFieldPaths(option, prefix)))];
    case 'record':
      return [
        ...textFieldPaths(def.keyType as z.ZodType, [...prefix, '{key}']),
        ...textFieldPaths(def.valueType as z.ZodType, [...prefix, '*']),
      ];
    case 'lazy':
      return [[...prefix, '*'].join('.')];
    default:
      return [];
  }
}

/** Every string in a JSON value, by path (array indices as they are). */
export function stringLeaves(value: unknown, prefix: (string | number)[] = []): (string | number)[][] {
  if (typeof value === 'string') return [prefix];
  if (Array.isArray(value)) return value.flatMap((item, index) => stringLeaves(item, [...prefix, index]));
  if (value && typeof value === 'object') {
    return Object.entries(value).flatMap(([key, item]) => stringLeaves(item, [...prefix, key]));
  }
  return [];
}

/** A deep copy of `value` with the thing at `path` replaced. */
export function withValueAt(value: unknown, path: (string | number)[], replacement: unknown): unknown {
  if (path.length === 0) return replacement;
  const copy = structuredClone(value) as Record<string | number, unknown>;
  let parent = copy;
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>;
  parent[path[path.length - 1]] = replacement;
  return copy;
}
