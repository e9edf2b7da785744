import type { TProbableCause } from '@shared/contracts/replays';
import { CAUSE_KIND_LABELS, labelFor } from '@shared/human-labels';

/** Flags per kind, kinds sorted by name so two replays line up row by row. */
export function countFlagsByKind(flags: readonly { kind: string }[]): Map<string, number> {
  const counts = new Map<string, number>();
  for (const flag of flags) counts.set(flag.kind, (counts.get(flag.kind) ?? 0) + 1);
  return new Map([...counts].sort(([a], [b]) => a.localeCompare(b)));
}

/** Rows for a side-by-side table: every kind seen in either replay, with both counts (0 when absent). */
export function flagCountRows(
  original: readonly { kind: string }[],
  verification: readonly { kind: string }[],
) {
  const before = countFlagsByKind(original);
  const after = countFlagsByKind(verification);
  const kinds = [...new Set([...before.keys(), ...after.keys()])].sort();
  return kinds.map((kind) => ({ kind, original: before.get(kind) ?? 0, verification: after.get(kind) ?? 0 }));
}

/** `0.042 m`, or an em dash for a missing value; RMSE is in metres in the replay metrics. */
export function formatMetres(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : `${value.toFixed(3)} m`;
}

/** `12.4 s` since the bundle start, or "never" when the replay did not diverge. */
export function formatDivergence(seconds: number | null | undefined): string {
  return seconds === null || seconds === undefined ? 'never' : `${seconds.toFixed(1)} s`;
}

/**
 * A replay's probable causes in one line, highest confidence first as the API lists them, e.g.
 * "Site differs from the map 72 %"; "none found" when it has none, "…" while loading.
 */
export function describeCauses(causes: readonly TProbableCause[] | undefined): string {
  if (causes === undefined) return '…';
  const found = causes.filter((cause) => cause.kind !== 'none');
  if (found.length === 0) return 'none found';
  return found
    .map((cause) => `${labelFor(CAUSE_KIND_LABELS, cause.kind)} ${Math.round(cause.confidence * 100)} %`)
    .join(' · ');
}
