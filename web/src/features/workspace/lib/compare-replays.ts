import type { TReplay } from '@shared/contracts/replays';

/** Nested settings as dotted paths (`resampling.threshold` → 0.5), arrays joined with "/". */
export function flattenSettings(value: unknown, prefix = ''): Record<string, string> {
  if (value === null || value === undefined) return prefix ? { [prefix]: '–' } : {};
  if (Array.isArray(value)) return { [prefix]: value.map(String).join(' / ') };
  if (typeof value === 'object') {
    const out: Record<string, string> = {};
    for (const [key, inner] of Object.entries(value)) {
      Object.assign(out, flattenSettings(inner, prefix ? `${prefix}.${key}` : key));
    }
    return out;
  }
  return { [prefix]: String(value) };
}

/** Settings that differ between two replays, in a stable order. */
export function settingsDifferences(
  left: TReplay,
  right: TReplay,
): { name: string; left: string; right: string }[] {
  const a = flattenSettings(left.settings ?? {});
  const b = flattenSettings(right.settings ?? {});
  const names = [...new Set([...Object.keys(a), ...Object.keys(b)])].sort();
  return names
    .filter((name) => a[name] !== b[name])
    .map((name) => ({ name, left: a[name] ?? '–', right: b[name] ?? '–' }));
}

/** Flags counted by kind. */
export function flagCountsByKind(replay: TReplay): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const flag of replay.flags) counts[flag.kind] = (counts[flag.kind] ?? 0) + 1;
  return counts;
}
