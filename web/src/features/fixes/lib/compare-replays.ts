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
