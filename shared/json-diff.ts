/** One changed leaf between two JSON values, named by its dotted path (`evidence.2.digest`). */
export interface JsonChange {
  path: string;
  before: unknown;
  after: unknown;
}

function isContainer(value: unknown): value is Record<string, unknown> | unknown[] {
  return typeof value === 'object' && value !== null;
}

/**
 * Lists the leaves that differ between two JSON values (arrays compared by index), in path
 * order, so the findings page can show what changed between versions.
 */
export function diffJson(before: unknown, after: unknown, path = ''): JsonChange[] {
  if (isContainer(before) && isContainer(after) && Array.isArray(before) === Array.isArray(after)) {
    const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort((a, b) =>
      Array.isArray(before) ? Number(a) - Number(b) : a < b ? -1 : a > b ? 1 : 0,
    );
    return keys.flatMap((key) =>
      diffJson(
        (before as Record<string, unknown>)[key],
        (after as Record<string, unknown>)[key],
        path ? `${path}.${key}` : key,
      ),
    );
  }
  if (JSON.stringify(before) === JSON.stringify(after)) return [];
  return [{ path: path || '(root)', before: before ?? null, after: after ?? null }];
}
